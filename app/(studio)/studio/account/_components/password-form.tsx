"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { changePasswordSchema, type ChangePasswordInput } from "@/lib/validations/account";
import { changePasswordAction } from "../actions";

/** Change the password (or set a first one for an account made by e-mail link). */
export function PasswordForm({ hasPassword }: { hasPassword: boolean }) {
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState<{ tone: "error"; text: string } | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordSchema),
  });
  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      setOutcome(null);
      // On success the action redirects back here with ?changed=1, and the page says so.
      const result = await changePasswordAction(values);
      showServerFieldErrors(setError, result.fields);
      if (result.error) setOutcome({ tone: "error", text: result.error });
    }),
  );
  const e = formState.errors;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex max-w-md flex-col gap-4 rounded-lg border border-ink/10 bg-white/50 p-5"
    >
      {hasPassword ? (
        <TextField
          id="current-password"
          label="Current password"
          error={e.currentPassword?.message}
          {...register("currentPassword")}
          type="password"
          autoComplete="current-password"
        />
      ) : null}
      <TextField
        id="new-password"
        label={hasPassword ? "New password" : "Password"}
        hint="At least 10 characters, with letters and a digit."
        error={e.newPassword?.message}
        {...register("newPassword")}
        type="password"
        autoComplete="new-password"
      />
      <Button type="submit" variant="accent" busy={pending}>
        {pending ? "Saving…" : hasPassword ? "Change password" : "Set password"}
      </Button>
      {outcome ? (
        <Notice tone={outcome.tone} testId="password-outcome">
          {outcome.text}
        </Notice>
      ) : null}
    </form>
  );
}
