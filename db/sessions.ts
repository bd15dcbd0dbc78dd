import { db, type Db } from "./index";

// Server-side sessions (migrations/20261206_012_sessions_and_limits.ts): a row per sign-in,
// checked with the user row on every request, ended when the person signs out, changes
// their password, signs out everywhere or is suspended.

export type EndReason = "sign_out" | "password_changed" | "signed_out_everywhere" | "suspended";

export interface SessionRow {
  id: string;
  user_id: string;
  created_at: string;
  expires_at: string;
  ended_at: string | null;
  ended_reason: EndReason | null;
}

export async function insertSession(row: Pick<SessionRow, "id" | "user_id" | "created_at" | "expires_at">, q: Db = db()): Promise<void> {
  await q("sessions").insert({ ...row, ended_at: null, ended_reason: null });
}

/** True when the session exists for this user, has not ended and has not run out. */
export async function sessionIsActive(id: string, userId: string, now: string, q: Db = db()): Promise<boolean> {
  const row = await q("sessions").first("id").where({ id, user_id: userId }).whereNull("ended_at").andWhere("expires_at", ">", now);
  return !!row;
}

export async function endSession(id: string, reason: EndReason, now: string, q: Db = db()): Promise<void> {
  await q("sessions").where({ id }).whereNull("ended_at").update({ ended_at: now, ended_reason: reason });
}

/** Ends every session of a person; returns how many were still going. */
export async function endSessionsOf(userId: string, reason: EndReason, now: string, q: Db = db()): Promise<number> {
  return q("sessions").where({ user_id: userId }).whereNull("ended_at").update({ ended_at: now, ended_reason: reason });
}

export async function activeSessionCount(userId: string, now: string, q: Db = db()): Promise<number> {
  const row = await q("sessions").count<{ n: number | string }[]>({ n: "*" }).where({ user_id: userId }).whereNull("ended_at").andWhere("expires_at", ">", now);
  return Number(row[0].n);
}

/** Drops sessions that ended or ran out before `before` (the worker's tidy-up). */
export async function pruneSessions(before: string, q: Db = db()): Promise<number> {
  return q("sessions")
    .where((b) => b.where("ended_at", "<", before).orWhere("expires_at", "<", before))
    .delete();
}
