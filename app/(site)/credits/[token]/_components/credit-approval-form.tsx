"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatDate } from "@/lib/dates";
import { LENGTH } from "@/lib/validations/limits";
import { creditApprovalSchema, type CreditApprovalInput } from "@/lib/validations/credits";
import type { CreditApprovedAnswer } from "@/lib/wire/credits";

/** The line as it will print, to approve as it is or after changing it. */
export function CreditApprovalForm({
  token,
  anthologyTitle,
  pieceTitle,
  creditLine,
}: {
  token: string;
  anthologyTitle: string;
  pieceTitle: string;
  creditLine: string;
}) {
  const [done, setDone] = useState<CreditApprovedAnswer | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreditApprovalInput>({
    resolver: zodResolver(creditApprovalSchema),
    defaultValues: { creditLine },
  });
  const current = watch("creditLine") ?? "";
  const edited = current.trim() !== creditLine;

  async function approve(values: CreditApprovalInput) {
    setProblem(null);
    try {
      const answer = await fetchJson<CreditApprovedAnswer>(
        `/api/credits/${encodeURIComponent(token)}`,
        {
          method: "POST",
          json: values,
          failure: (status) => `Not approved (error ${status}); nothing was changed.`,
        },
      );
      setDone(answer);
    } catch (e) {
      if (e instanceof ApiError && e.fieldMessage("creditLine"))
        setError("creditLine", { message: e.fieldMessage("creditLine")! });
      else setProblem(e instanceof Error ? e.message : "Not approved; nothing was changed.");
    }
  }

  if (done)
    return (
      <Notice title="Thank you: your credit is approved" testId="credit-approved">
        “{pieceTitle}” will be credited in {anthologyTitle} as “{done.creditLine}” (approved on{" "}
        {formatDate(new Date(done.approvedAt))}). If it needs to change later, edit it on your
        piece’s page or write to the editors; you will be asked to approve it again.
      </Notice>
    );

  return (
    <form onSubmit={handleSubmit(approve)} className="flex flex-col gap-4" noValidate>
      <div className="rounded-md border border-ink/15 bg-white/60 p-4">
        <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
          As it will print on the credits page
        </p>
        <p className="mt-1 font-display text-lg" data-testid="credit-preview">
          {pieceTitle} — {current.trim() || "…"}
        </p>
      </div>
      <TextField
        id="creditLine"
        label="Credit line"
        hint="Your name as it should appear, and anything you want beside it (a collective, a place). One line."
        maxLength={LENGTH.creditLine}
        autoComplete="off"
        error={errors.creditLine?.message}
        {...register("creditLine")}
      />
      {problem ? (
        <Notice tone="error" testId="credit-approval-problem">
          {problem}
        </Notice>
      ) : null}
      <div>
        <Button type="submit" busy={isSubmitting}>
          {edited ? "Save and approve this wording" : "Approve this credit line"}
        </Button>
      </div>
    </form>
  );
}
