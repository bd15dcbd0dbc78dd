import "server-only";
import { pruneCounters } from "@/db/rate-limits";
import { pruneSessions } from "@/db/sessions";
import { resolveContext, type Context } from "@/lib/context";
import { systemClock } from "@/lib/time/clock";

// Sessions that ended or ran out, and rate-limit counters whose window has long passed, are
// kept a week (enough to answer "was I signed in from somewhere else?"), then dropped.
// By the wall clock, not the worker's: the app checks sessions and limits against the wall
// clock, and a worker clock moved on (DUFFBANK_CLOCK, the end-to-end run's clock file) must
// not delete a session the app still honours.
const KEEP_DAYS = 7;

export async function pruneSecurityRecords(ctx: Context = {}): Promise<{ sessions: number; counters: number }> {
  const { db: q } = resolveContext(ctx);
  const before = new Date(systemClock().getTime() - KEEP_DAYS * 86_400_000).toISOString();
  return { sessions: await pruneSessions(before, q), counters: await pruneCounters(before, q) };
}
