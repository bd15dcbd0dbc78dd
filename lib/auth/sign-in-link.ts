import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { db, type Db } from "@/db/index";
import { appUrl, authUrl } from "@/lib/env";
import { AUTH_SECRET } from "./config";
import { safeCallbackPath } from "./callback-url";

// A one-time sign-in link of the kind next-auth's e-mail sign-in sends, for the confirmation
// e-mail on joining: the token is stored hashed the way next-auth checks it (SHA-256 of the
// token and the secret, next-auth 4 core/lib/utils.js hashToken), so following it signs in
// through next-auth's own e-mail callback, which also marks the address confirmed.

export const CONFIRM_LINK_HOURS = 24;

export async function signInLink(email: string, callbackPath: string, now: Date = new Date(), q: Db = db()): Promise<string> {
  const token = randomBytes(32).toString("hex");
  await q("verification_tokens").insert({
    identifier: email,
    token: createHash("sha256").update(`${token}${AUTH_SECRET}`).digest("hex"),
    expires: new Date(now.getTime() + CONFIRM_LINK_HOURS * 3_600_000).toISOString(),
  });
  const base = new URL(authUrl()).origin;
  const params = new URLSearchParams({ callbackUrl: `${appUrl()}${safeCallbackPath(callbackPath)}`, token, email });
  return `${base}/api/auth/callback/email?${params}`;
}
