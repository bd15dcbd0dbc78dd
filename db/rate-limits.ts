import { db, type Db } from "./index";

// Shared rate-limit counters (migrations/20261206_012_sessions_and_limits.ts). One row per
// limited thing; a hit is one statement — an upsert that starts a new window when the old one
// has passed and otherwise adds one — so concurrent processes, on SQLite or PostgreSQL, never
// lose a count.

export interface Counter {
  count: number;
  window_started_at: string;
}

/** Adds one to `key` in the window that started after `windowStart` (else a new window at `now`); returns the counter. */
export async function hitCounter(key: string, now: string, windowStart: string, q: Db = db()): Promise<Counter> {
  await q("rate_limits")
    .insert({ key, window_started_at: now, count: 1 })
    .onConflict("key")
    .merge({
      count: q.raw("CASE WHEN rate_limits.window_started_at <= ? THEN 1 ELSE rate_limits.count + 1 END", [windowStart]),
      window_started_at: q.raw("CASE WHEN rate_limits.window_started_at <= ? THEN ? ELSE rate_limits.window_started_at END", [windowStart, now]),
    });
  return (await readCounter(key, windowStart, q)) ?? { count: 1, window_started_at: now };
}

/** The counter of `key` if its window is still open (started after `windowStart`). */
export async function readCounter(key: string, windowStart: string, q: Db = db()): Promise<Counter | undefined> {
  const row = await q("rate_limits").first("count", "window_started_at").where({ key }).andWhere("window_started_at", ">", windowStart);
  return row ? { count: Number(row.count), window_started_at: new Date(row.window_started_at).toISOString() } : undefined;
}

export async function clearCounter(key: string, q: Db = db()): Promise<void> {
  await q("rate_limits").where({ key }).delete();
}

/** Drops counters whose window started before `before` (the worker's tidy-up). */
export async function pruneCounters(before: string, q: Db = db()): Promise<number> {
  return q("rate_limits").where("window_started_at", "<", before).delete();
}
