import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { eq } from "drizzle-orm";
import NextAuth, { type DefaultSession } from "next-auth";
import type {} from "next-auth/jwt";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { db, schema } from "@/db";
import { verifyPassword } from "@/server/auth/password";
import { env } from "@/lib/env";
import { sendMail, simpleHtml } from "@/server/mail";
import { signInSchema } from "@/lib/validations/account";

declare module "next-auth" {
  interface Session {
    user: { id: string } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
  }
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  adapter: DrizzleAdapter(db, {
    usersTable: schema.users,
    accountsTable: schema.accounts,
    sessionsTable: schema.sessions,
    verificationTokensTable: schema.verificationTokens,
  }),
  // Credentials sign-in only works with JWT sessions; the adapter still stores users and link tokens.
  session: { strategy: "jwt" },
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
      async authorize(raw) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const [user] = await db
          .select()
          .from(schema.users)
          .where(eq(schema.users.email, parsed.data.email))
          .limit(1);
        if (!user?.passwordHash) return null;
        if (!(await verifyPassword(user.passwordHash, parsed.data.password))) return null;
        return { id: user.id, name: user.name, email: user.email };
      },
    }),
    Nodemailer({
      server: { host: env().SMTP_HOST, port: env().SMTP_PORT },
      from: env().MAIL_FROM,
      maxAge: 60 * 60,
      async sendVerificationRequest({ identifier, url }) {
        await sendMail({
          to: identifier,
          subject: "Your Quireline sign-in link",
          text: `Open this link to sign in to Quireline:\n\n${url}\n\nIt works once and expires in an hour. If you did not ask for it, ignore this message.`,
          html: simpleHtml(
            [
              "Open the link below to sign in to Quireline. It works once and expires in an hour.",
              "If you did not ask for it, ignore this message.",
            ],
            { href: url, label: "Sign in to Quireline" },
          ),
        });
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) token.uid = user.id;
      return token;
    },
    session({ session, token }) {
      if (token.uid) session.user.id = token.uid;
      return session;
    },
  },
});
