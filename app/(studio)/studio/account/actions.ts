"use server";

import { redirect } from "next/navigation";
import { signIn } from "@/auth";
import { passwordHashOf, replacePassword } from "@/db/queries/users";
import { changePasswordSchema } from "@/lib/validations/account";
import { fieldErrors } from "@/server/api";
import { currentUser } from "@/server/auth/guard";
import { hashPassword, verifyPassword } from "@/server/auth/password";

/** What comes back when the password is not changed; on success the action redirects instead. */
export type PasswordResult = { error?: string; fields?: Record<string, string[]> };

/**
 * Replaces the signed-in person's password. Every session they hold ends with it (the session
 * version is bumped in the same statement); this browser is signed in again with the new one and
 * sent back to the account page, which says so.
 */
export async function changePasswordAction(input: unknown): Promise<PasswordResult> {
  const user = await currentUser();
  if (!user?.email) return { error: "Sign in again first: your session has ended." };
  const parsed = changePasswordSchema.safeParse(input);
  if (!parsed.success) return { fields: fieldErrors(parsed.error) };
  const { currentPassword, newPassword } = parsed.data;
  const hash = await passwordHashOf(user.id);
  if (hash === undefined) return { error: "This account no longer exists." };
  if (hash !== null && !(currentPassword && (await verifyPassword(hash, currentPassword))))
    return { fields: { currentPassword: ["That is not your current password."] } };
  await replacePassword(user.id, await hashPassword(newPassword));
  // The old session ended with the others; a fresh request picks up the new one.
  await signIn("credentials", { email: user.email, password: newPassword, redirect: false });
  redirect("/studio/account?changed=1");
}
