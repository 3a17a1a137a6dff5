import { z } from "zod";
import { LENGTH } from "./limits";
import { singleLineText } from "./text";

/** An e-mail address, trimmed and lowercased, that fits the e-mail columns (varchar(255)). */
export const emailSchema = singleLineText(LENGTH.email)
  .toLowerCase()
  .pipe(z.email("Enter an e-mail address like name@example.org"));

/** At least 10 characters with a letter and a digit, and not one of the passwords everyone tries. */
export const newPasswordSchema = z
  .string()
  .min(10, "Use at least 10 characters")
  .max(200, "Use at most 200 characters")
  .refine((p) => /[A-Za-z]/.test(p) && /\d/.test(p), "Mix letters and at least one digit")
  .refine((p) => !COMMON_PASSWORDS.has(p.toLowerCase()), "That password is too easy to guess");

const COMMON_PASSWORDS = new Set([
  "password123",
  "password1234",
  "qwerty12345",
  "1234567890a",
  "letmein1234",
]);

export const signUpSchema = z.object({
  name: singleLineText(LENGTH.personName).min(1, "Tell us your name"),
  email: emailSchema,
  password: newPasswordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password"),
});

export const emailLinkSchema = z.object({ email: emailSchema });

/** Changing (or, for link-only accounts, setting) the password; the current one is checked on the server. */
export const changePasswordSchema = z.object({
  currentPassword: z.string().max(200, "Use at most 200 characters").optional(),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
