import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { eq } from "drizzle-orm";
import NextAuth, { CredentialsSignin, type DefaultSession } from "next-auth";
import type {} from "next-auth/jwt";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { db, schema } from "@/db";
import { bumpSessionVersion, sessionVersionOf } from "@/db/queries/users";
import { verifyPassword } from "@/server/auth/password";
import { env } from "@/lib/env";
import { signInLinkMail } from "@/lib/mail/templates/sign-in-link";
import { sendMail } from "@/server/mail";
import { addressOf, consume, firstRefusal, reset } from "@/server/rate-limit";
import { signInSchema } from "@/lib/validations/account";

declare module "next-auth" {
  interface Session {
    user: { id: string } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
    /** The account's session version when the token was issued; see `sessionVersion` in db/schema.ts. */
    sv?: number;
  }
}

/** A sign-in refused because the account or the address has used up its tries. */
export class SignInLimited extends CredentialsSignin {
  code = "rate_limited";
}

/** How long a session lasts without use; every request within it extends it by as much. */
export const SESSION_IDLE_SECONDS = 12 * 60 * 60;

export const { handlers, auth, signIn, signOut } = NextAuth({
  adapter: DrizzleAdapter(db, {
    usersTable: schema.users,
    accountsTable: schema.accounts,
    sessionsTable: schema.sessions,
    verificationTokensTable: schema.verificationTokens,
  }),
  // Credentials sign-in only works with JWT sessions; the adapter still stores users and link tokens.
  session: { strategy: "jwt", maxAge: SESSION_IDLE_SECONDS },
  secret: env().AUTH_SECRET,
  trustHost: true,
  pages: {
    signIn: "/sign-in",
    verifyRequest: "/sign-in/check-email",
    error: "/sign-in/problem",
  },
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw, request) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        // Failures count per account and per address (lib/rate-limits.ts); over either, even the
        // right password waits, so guessing cannot go on by luck.
        const keys = [
          ["signInAccount", parsed.data.email],
          ["signInAddress", addressOf(request.headers)],
        ] as const;
        if (!(await firstRefusal(keys)).ok) throw new SignInLimited();
        const [user] = await db
          .select()
          .from(schema.users)
          .where(eq(schema.users.email, parsed.data.email))
          .limit(1);
        const matches =
          !!user?.passwordHash && (await verifyPassword(user.passwordHash, parsed.data.password));
        if (!user || !matches) {
          await firstRefusal(keys, consume);
          return null;
        }
        await reset("signInAccount", parsed.data.email);
        return { id: user.id, name: user.name, email: user.email };
      },
    }),
    Nodemailer({
      server: { host: env().SMTP_HOST, port: env().SMTP_PORT },
      from: env().MAIL_FROM,
      maxAge: 60 * 60,
      async sendVerificationRequest({ identifier, url, request }) {
        const limited = await firstRefusal(
          [
            ["emailLinkAccount", identifier],
            ["emailLinkAddress", addressOf(request.headers)],
          ],
          consume,
        );
        if (!limited.ok) throw new Error(limited.message);
        await sendMail({ to: identifier, ...signInLinkMail(url) });
      },
    }),
  ],
  events: {
    // Signing out ends this token and every other one the person holds.
    async signOut(message) {
      const uid = "token" in message ? message.token?.uid : undefined;
      if (uid) await bumpSessionVersion(uid);
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      if (user?.id) {
        token.uid = user.id;
        token.sv = (await sessionVersionOf(user.id)) ?? 0;
        return token;
      }
      // Every later use re-reads the version: a sign-out, a password change or a role removal
      // elsewhere has bumped it, and the old token is then refused (null clears the cookie).
      if (!token.uid) return null;
      const current = await sessionVersionOf(token.uid);
      if (current === undefined || current !== token.sv) return null;
      return token;
    },
    session({ session, token }) {
      if (token.uid) session.user.id = token.uid;
      return session;
    },
  },
});
