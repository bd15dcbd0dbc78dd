import "server-only";
import { randomBytes } from "node:crypto";
import { db, type Db } from "@/db/index";
import { endSession, endSessionsOf, insertSession, sessionIsActive, type EndReason } from "@/db/sessions";
import { SESSION_MAX_AGE_S } from "./config";
import type { Clock } from "@/lib/time/clock";

// A signed-in session is two halves: the signed, encrypted cookie next-auth issues (it
// carries the user id and this session's id), and the sessions row the id names. Both must
// hold for a request to count as signed in, so ending the row ends the cookie and every copy.


export async function startSession(userId: string, clock: Clock = () => new Date(), q: Db = db()): Promise<string> {
  const now = clock();
  const id = randomBytes(24).toString("base64url");
  await insertSession({ id, user_id: userId, created_at: now.toISOString(), expires_at: new Date(now.getTime() + SESSION_MAX_AGE_S * 1000).toISOString() }, q);
  return id;
}

/** The user id of a decoded session token whose session is still going, else null. */
export async function activeUserId(token: Record<string, unknown> | null, clock: Clock = () => new Date(), q: Db = db()): Promise<string | null> {
  if (!token || typeof token.uid !== "string" || typeof token.sid !== "string") return null;
  return (await sessionIsActive(token.sid, token.uid, clock().toISOString(), q)) ? token.uid : null;
}

export async function endOneSession(sid: unknown, reason: EndReason = "sign_out", clock: Clock = () => new Date(), q: Db = db()): Promise<void> {
  if (typeof sid === "string") await endSession(sid, reason, clock().toISOString(), q);
}

export async function endEverySession(userId: string, reason: EndReason, clock: Clock = () => new Date(), q: Db = db()): Promise<number> {
  return endSessionsOf(userId, reason, clock().toISOString(), q);
}
