import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import EmailProvider from "next-auth/providers/email";
import { findUserByEmail, findUserById, membershipsOf, rolesOf } from "@/db/users";
import { signInSchema } from "@/lib/validation/auth";
import { sendMail } from "@/lib/mail/transport";
import { magicLinkEmail } from "@/lib/mail/templates/magic-link";
import { AUTH_SECRET, SESSION_MAX_AGE_S } from "./config";
import { knexAdapter } from "./knex-adapter";
import { verifyPassword } from "./password";

export const authOptions: NextAuthOptions = {
  secret: AUTH_SECRET,
  adapter: knexAdapter(),
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
  pages: { signIn: "/sign-in", verifyRequest: "/sign-in/check-email", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      id: "credentials",
      name: "E-mail and password",
      credentials: { email: { type: "email" }, password: { type: "password" } },
      async authorize(raw) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const user = await findUserByEmail(parsed.data.email);
        const ok = await verifyPassword(parsed.data.password, user?.password_hash);
        if (!user || !ok || !user.password_hash) return null;
        if (user.suspended_at) throw new Error("suspended");
        return { id: user.id, email: user.email, name: user.display_name };
      },
    }),
    EmailProvider({
      // Delivery goes through our own transport; the server settings here are unused.
      server: { host: "127.0.0.1", port: 0 },
      from: "Duffbank <hello@duffbank.test>",
      maxAge: 15 * 60,
      async sendVerificationRequest({ identifier, url }) {
        const mail = magicLinkEmail(url);
        await sendMail({ to: identifier, ...mail });
      },
    }),
  ],
  callbacks: {
    async signIn({ user, account }) {
      if (account?.provider !== "email") return true;
      // A link is sent only to an existing, active account; unknown addresses sign up first.
      const existing = user.email ? await findUserByEmail(user.email) : undefined;
      return !!existing && !existing.suspended_at;
    },
    async jwt({ token, user }) {
      if (user?.id) token.uid = user.id;
      if (typeof token.uid === "string") {
        const row = await findUserById(token.uid);
        if (row) {
          const [roles, orgs] = await Promise.all([rolesOf(row.id), membershipsOf(row.id)]);
          token.roles = roles.filter((r) => r.status === "active").map((r) => r.role);
          token.organisation_id = orgs[0]?.organisation_id ?? null;
          token.name = row.display_name;
        }
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === "string") {
        session.user.id = token.uid;
        session.user.roles = (token.roles as string[] | undefined) ?? [];
        session.user.organisation_id = (token.organisation_id as string | null | undefined) ?? null;
      }
      return session;
    },
  },
};
