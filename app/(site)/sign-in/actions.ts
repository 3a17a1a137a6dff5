"use server";

import { eq } from "drizzle-orm";
import { AuthError } from "next-auth";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { signIn } from "@/auth";
import { db, schema } from "@/db";
import { fieldErrors } from "@/server/api";
import { hashPassword } from "@/server/auth/password";
import { addressOf, consume, firstRefusal } from "@/server/rate-limit";
import { emailLinkSchema, signInSchema, signUpSchema } from "@/lib/validations/account";

export type FormResult = { error?: string; fields?: Record<string, string[]> } | undefined;

/** Only same-site paths are followed after sign-in. */
function safeReturn(callbackUrl: unknown): string {
  return typeof callbackUrl === "string" &&
    callbackUrl.startsWith("/") &&
    !callbackUrl.startsWith("//")
    ? callbackUrl
    : "/studio";
}

export async function signUpAction(input: unknown, callbackUrl?: string): Promise<FormResult> {
  const parsed = signUpSchema.safeParse(input);
  if (!parsed.success) return { fields: fieldErrors(parsed.error) };
  const { name, email, password } = parsed.data;
  const limited = await consume("signUpAddress", addressOf(await headers()));
  if (!limited.ok) return { error: limited.message };
  const [existing] = await db
    .select({ id: schema.users.id })
    .from(schema.users)
    .where(eq(schema.users.email, email))
    .limit(1);
  if (existing) {
    return {
      fields: {
        email: [
          "An account with this e-mail already exists. Sign in instead, or ask for a sign-in link.",
        ],
      },
    };
  }
  try {
    await db
      .insert(schema.users)
      .values({ name, email, passwordHash: await hashPassword(password) });
  } catch (error) {
    if (String(error).includes("Duplicate entry")) {
      return {
        fields: { email: ["An account with this e-mail already exists. Sign in instead."] },
      };
    }
    throw error;
  }
  await signIn("credentials", { email, password, redirect: false });
  redirect(safeReturn(callbackUrl));
}

export async function passwordSignInAction(
  input: unknown,
  callbackUrl?: string,
): Promise<FormResult> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { fields: fieldErrors(parsed.error) };
  const limited = await firstRefusal([
    ["signInAccount", parsed.data.email],
    ["signInAddress", addressOf(await headers())],
  ]);
  if (!limited.ok) return { error: limited.message };
  try {
    await signIn("credentials", { ...parsed.data, redirect: false });
  } catch (error) {
    if (error instanceof AuthError)
      return { error: "That e-mail and password do not match an account." };
    throw error;
  }
  redirect(safeReturn(callbackUrl));
}

export async function emailLinkAction(input: unknown, callbackUrl?: string): Promise<FormResult> {
  const parsed = emailLinkSchema.safeParse(input);
  if (!parsed.success) return { fields: fieldErrors(parsed.error) };
  const limited = await firstRefusal([
    ["emailLinkAccount", parsed.data.email],
    ["emailLinkAddress", addressOf(await headers())],
  ]);
  if (!limited.ok) return { error: limited.message };
  try {
    await signIn("nodemailer", {
      email: parsed.data.email,
      redirect: false,
      redirectTo: safeReturn(callbackUrl),
    });
  } catch (error) {
    if (error instanceof AuthError)
      return { error: "We could not send the link just now. Try again in a minute." };
    throw error;
  }
  redirect(`/sign-in/check-email?email=${encodeURIComponent(parsed.data.email)}`);
}
