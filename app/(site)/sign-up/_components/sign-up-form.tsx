"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useTransition } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { signUpSchema, type SignUpInput } from "@/lib/validations/account";
import { signUpAction } from "../../sign-in/actions";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";

/** Name, e-mail and password; field errors come from the shared schema and from the server. */
export function SignUpForm({ callbackUrl }: { callbackUrl?: string }) {
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, setError, formState } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
  });
  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      const result = await signUpAction(values, callbackUrl);
      showServerFieldErrors(setError, result?.fields);
    }),
  );
  const e = formState.errors;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-4 rounded-lg border border-ink/10 bg-white/50 p-5"
    >
      <TextField
        id="name"
        label="Your name"
        hint="As you would like editors to see it."
        error={e.name?.message}
        {...register("name")}
        autoComplete="name"
      />
      <TextField
        id="email"
        label="E-mail"
        error={e.email?.message}
        {...register("email")}
        type="email"
        autoComplete="email"
      />
      <TextField
        id="password"
        label="Password"
        hint="At least 10 characters, with letters and a digit."
        error={e.password?.message}
        {...register("password")}
        type="password"
        autoComplete="new-password"
      />
      <Button type="submit" variant="accent" busy={pending}>
        {pending ? "Creating your account…" : "Create account"}
      </Button>
    </form>
  );
}
