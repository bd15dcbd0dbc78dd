import "server-only";
import { db, type Db } from "@/db/index";
import { pruneCounters } from "@/db/rate-limits";
import { pruneSessions } from "@/db/sessions";

// Sessions that ended or ran out, and rate-limit counters whose window has long passed, are
// kept a week (enough to answer "was I signed in from somewhere else?"), then dropped.
const KEEP_DAYS = 7;

export async function pruneSecurityRecords(clock: () => Date = () => new Date(), q: Db = db()): Promise<{ sessions: number; counters: number }> {
  const before = new Date(clock().getTime() - KEEP_DAYS * 86_400_000).toISOString();
  return { sessions: await pruneSessions(before, q), counters: await pruneCounters(before, q) };
}
