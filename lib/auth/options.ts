import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import EmailProvider from "next-auth/providers/email";
import { findUserByEmail, findUserById, membershipsOf, rolesOf, setPasswordHash } from "@/db/users";
import { signInSchema } from "@/lib/validation/auth";
import { sendMail } from "@/lib/mail/transport";
import { magicLinkEmail } from "@/lib/mail/templates/magic-link";
import { noAccountEmail } from "@/lib/mail/templates/accounts";
import { appUrl, authUrl } from "@/lib/env";
import { LIMITS, clientAddress, ensureUnder, forgive, recordFailure } from "@/lib/security/rate-limit";
import { AUTH_SECRET, SESSION_MAX_AGE_S } from "./config";
import { safeCallbackPath } from "./callback-url";
import { knexAdapter } from "./knex-adapter";
import { hashPassword, needsRehash, verifyPassword } from "./password";
import { activeUserId, endOneSession, startSession } from "./sessions";

/** What next-auth answers when it has sent a sign-in link; an unknown address gets the same. */
function linkSentUrl(): string {
  const base = new URL(authUrl());
  return `${base.origin}/api/auth/verify-request?provider=email&type=email`;
}

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
      async authorize(raw, req) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const limits: Parameters<typeof recordFailure>[0] = [
          [LIMITS.signInAccount, email],
          [LIMITS.signInAddress, clientAddress(req?.headers ?? {})],
        ];
        // The route refuses first with a 429 (app/api/auth/[...nextauth]/route.ts); this holds if it is reached anyway.
        try {
          await ensureUnder(limits);
        } catch {
          throw new Error("rate_limited");
        }
        const user = await findUserByEmail(email);
        // One scrypt for every answer: unknown accounts verify against a stand-in hash.
        const ok = await verifyPassword(password, user?.password_hash);
        if (!user || !ok || !user.password_hash) {
          await recordFailure(limits);
          return null;
        }
        if (user.suspended_at) throw new Error("suspended");
        await forgive(LIMITS.signInAccount, email);
        if (needsRehash(user.password_hash)) await setPasswordHash(user.id, await hashPassword(password));
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
    async signIn({ user, account, email }) {
      if (account?.provider !== "email") return true;
      const existing = user.email ? await findUserByEmail(user.email) : undefined;
      if (existing && !existing.suspended_at) return true;
      if (email?.verificationRequest && user.email) {
        // Asking for a link answers the same whether or not the address has an account; the
        // inbox says which, to its owner only.
        if (!existing) await sendMail({ to: user.email, ...noAccountEmail(`${appUrl()}/sign-up?email=${encodeURIComponent(user.email)}`) });
        return linkSentUrl();
      }
      return false;
    },
    async redirect({ url, baseUrl }) {
      // Only back to this site: an absolute URL on it, or a safe path; anything else goes home.
      const path = url.startsWith(`${baseUrl}/`) ? url.slice(baseUrl.length) : url;
      return `${baseUrl}${safeCallbackPath(path)}`;
    },
    async jwt({ token, user }) {
      if (user?.id) {
        // A new sign-in: its own server-side session, ended on sign-out (lib/auth/sessions.ts).
        token.uid = user.id;
        token.sid = await startSession(user.id);
      }
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
      // A cookie whose session has ended (signed out, or ended everywhere) is nobody.
      if (!(await activeUserId(token))) return { expires: session.expires } as typeof session;
      if (session.user && typeof token.uid === "string") {
        session.user.id = token.uid;
        session.user.roles = (token.roles as string[] | undefined) ?? [];
        session.user.organisation_id = (token.organisation_id as string | null | undefined) ?? null;
      }
      return session;
    },
  },
  events: {
    async signOut({ token }) {
      await endOneSession(token?.sid);
    },
  },
};
