"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ROLE_LABELS, type Role } from "@/lib/domain";
import { inviteSchema } from "@/lib/validations/anthology";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { InvitationSentAnswer } from "@/lib/wire/anthologies";

type InviteValues = z.input<typeof inviteSchema>;

/** Sends an invitation e-mail with a role; shows who was invited. */
export function InviteForm({ slug, roles }: { slug: string; roles: Role[] }) {
  const [result, setResult] = useState<{ tone: "info" | "error"; text: string }>();
  const { register, handleSubmit, setError, reset, formState } = useForm<InviteValues>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: "", role: "contributor" },
  });
  const onSubmit = handleSubmit(async (values) => {
    setResult(undefined);
    try {
      const sent = await fetchJson<InvitationSentAnswer>(`/api/anthologies/${slug}/invitations`, {
        method: "POST",
        json: values,
        failure: "The invitation was not sent.",
      });
      setResult({ tone: "info", text: `Invitation sent to ${sent.invited}.` });
      reset({ email: "", role: values.role });
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      showServerFieldErrors(setError, error.fields);
      setResult({ tone: "error", text: error.message });
    }
  });
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-3">
      <Field id="invite-email" label="E-mail" error={e.email?.message}>
        <input
          {...register("email")}
          {...describedBy("invite-email", e.email?.message)}
          type="email"
          className={`${inputClass} w-72`}
        />
      </Field>
      <Field id="invite-role" label="Role">
        <select
          {...register("role")}
          {...describedBy("invite-role")}
          className={`${inputClass} bg-white`}
        >
          {roles.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
      </Field>
      <Button type="submit" busy={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : "Send invitation"}
      </Button>
      {result ? (
        <div className="w-full">
          <Notice tone={result.tone} testId="invite-result">
            {result.text}
          </Notice>
        </div>
      ) : null}
    </form>
  );
}
