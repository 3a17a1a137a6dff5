"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { emailLinkSchema, signInSchema } from "@/lib/validations/account";
import { emailLinkAction, passwordSignInAction } from "../actions";

type PasswordForm = { email: string; password: string };

/** Password sign-in and e-mail-link sign-in, side by side. */
export function SignInForms({ callbackUrl }: { callbackUrl?: string }) {
  return (
    <div className="grid gap-8 md:grid-cols-2">
      <PasswordSignIn callbackUrl={callbackUrl} />
      <EmailLinkSignIn callbackUrl={callbackUrl} />
    </div>
  );
}

function PasswordSignIn({ callbackUrl }: { callbackUrl?: string }) {
  const [pending, startTransition] = useTransition();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, formState } = useForm<PasswordForm>({
    resolver: zodResolver(signInSchema),
  });
  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      setFormError(undefined);
      const result = await passwordSignInAction(values, callbackUrl);
      if (result?.error) setFormError(result.error);
      showServerFieldErrors(setError, result?.fields);
    }),
  );
  const e = formState.errors;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-4 rounded-lg border border-ink/10 bg-white/50 p-5"
      aria-labelledby="pw-title"
    >
      <h2 id="pw-title" className="text-xl font-semibold">
        With your password
      </h2>
      {formError ? (
        <Notice tone="error" testId="sign-in-error">
          {formError}
        </Notice>
      ) : null}
      <TextField
        id="pw-email"
        label="E-mail"
        error={e.email?.message}
        {...register("email")}
        type="email"
        autoComplete="email"
      />
      <TextField
        id="pw-password"
        label="Password"
        error={e.password?.message}
        {...register("password")}
        type="password"
        autoComplete="current-password"
      />
      <Button type="submit" busy={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}

function EmailLinkSignIn({ callbackUrl }: { callbackUrl?: string }) {
  const [pending, startTransition] = useTransition();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, formState } = useForm<{ email: string }>({
    resolver: zodResolver(emailLinkSchema),
  });
  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      setFormError(undefined);
      const result = await emailLinkAction(values, callbackUrl);
      if (result?.error) setFormError(result.error);
      showServerFieldErrors(setError, result?.fields);
    }),
  );
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-4 rounded-lg border border-ink/10 bg-white/50 p-5"
      aria-labelledby="link-title"
    >
      <h2 id="link-title" className="text-xl font-semibold">
        With a link by e-mail
      </h2>
      <p className="text-sm text-ink-soft">
        No password needed: we send a link that signs you in once, within the hour.
      </p>
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <TextField
        id="link-email"
        label="E-mail"
        error={formState.errors.email?.message}
        {...register("email")}
        type="email"
        autoComplete="email"
      />
      <Button type="submit" variant="quiet" busy={pending}>
        {pending ? "Sending…" : "Send me a sign-in link"}
      </Button>
    </form>
  );
}
