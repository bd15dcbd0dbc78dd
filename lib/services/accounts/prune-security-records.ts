import "server-only";
import { db, type Db } from "@/db/index";
import { pruneCounters } from "@/db/rate-limits";
import { pruneSessions } from "@/db/sessions";

// Sessions that ended or ran out, and rate-limit counters whose window has long passed, are
// kept a week (enough to answer "was I signed in from somewhere else?"), then dropped.
// By the wall clock, not the worker's: the app checks sessions and limits against the wall
// clock, and a worker clock moved on (DUFFBANK_CLOCK, the end-to-end run's clock file) must
// not delete a session the app still honours.
const KEEP_DAYS = 7;

export async function pruneSecurityRecords(q: Db = db()): Promise<{ sessions: number; counters: number }> {
  const before = new Date(Date.now() - KEEP_DAYS * 86_400_000).toISOString();
  return { sessions: await pruneSessions(before, q), counters: await pruneCounters(before, q) };
}
