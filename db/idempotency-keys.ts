import { db, type Db } from "./index";
import { isUniqueViolation } from "./dialect";

// The first answer to a request sent with an Idempotency-Key, per person and key, kept for a
// day (lib/api/idempotency.ts). A row is "running" while its first request is being served.

export interface IdempotencyRow {
  user_id: string;
  idem_key: string;
  method: string;
  path: string;
  request_hash: string;
  state: "running" | "done";
  response_status: number | null;
  response_body: string | null;
  created_at: string;
  completed_at: string | null;
  expires_at: string;
}

export async function findIdempotencyKey(userId: string, key: string, q: Db = db()): Promise<IdempotencyRow | undefined> {
  return q<IdempotencyRow>("idempotency_keys").first("*").where({ user_id: userId, idem_key: key });
}

/**
 * Takes the key for a request about to run: true when this request is the first with it.
 * An expired row is cleared first, so a key may be used again after its day is over.
 */
export async function claimIdempotencyKey(row: Omit<IdempotencyRow, "state" | "response_status" | "response_body" | "completed_at">, q: Db = db()): Promise<boolean> {
  await q("idempotency_keys").where({ user_id: row.user_id, idem_key: row.idem_key }).andWhere("expires_at", "<=", row.created_at).delete();
  try {
    await q("idempotency_keys").insert({ ...row, state: "running", response_status: null, response_body: null, completed_at: null });
    return true;
  } catch (err) {
    if (isUniqueViolation(err)) return false;
    throw err;
  }
}

export async function completeIdempotencyKey(userId: string, key: string, status: number, body: string, at: string, q: Db = db()): Promise<void> {
  await q("idempotency_keys").where({ user_id: userId, idem_key: key }).update({ state: "done", response_status: status, response_body: body, completed_at: at });
}

/** The worker's tidy-up: keys past their day. */
export async function pruneIdempotencyKeys(now: string, q: Db = db()): Promise<number> {
  return q("idempotency_keys").where("expires_at", "<=", now).delete();
}
