import "server-only";
import { createHmac } from "node:crypto";
import { db, type Db } from "@/db/index";
import { clearCounter, hitCounter, readCounter } from "@/db/rate-limits";
import { ApiError } from "@/lib/api/errors";
import { AUTH_SECRET } from "@/lib/auth/config";
import type { Clock } from "@/lib/time/clock";

// The limits on signing in and joining, counted in the database (db/rate-limits.ts) so every
// app process shares them. Per account (or e-mail) they are tight; per client address they
// are looser, so one shared address (a library, a school, a mobile network) is not locked out
// by the attacker of one account behind it. Figures: common practice, no source.

export interface Limit {
  name: string;
  max: number;
  windowMs: number;
  /** What was refused, for the message: "Too many {what}." */
  what: string;
}

const MINUTE = 60_000;

export const LIMITS = {
  signInAccount: { name: "sign-in:account", max: 10, windowMs: 15 * MINUTE, what: "failed sign-ins to this account" },
  signInAddress: { name: "sign-in:address", max: 50, windowMs: 15 * MINUTE, what: "failed sign-ins from your network" },
  linkEmail: { name: "link:email", max: 5, windowMs: 60 * MINUTE, what: "sign-in links asked for this address" },
  linkAddress: { name: "link:address", max: 20, windowMs: 60 * MINUTE, what: "sign-in links asked for from your network" },
  signUpAddress: { name: "sign-up:address", max: 20, windowMs: 60 * MINUTE, what: "new accounts from your network" },
  // Enough to move a pin about while filling in a listing, too few to sweep a town for one need.
  demandPreview: { name: "demand:account", max: 120, windowMs: 60 * MINUTE, what: "demand look-ups from your account" },
} satisfies Record<string, Limit>;


/** A keyed hash of what is counted, so the table holds no e-mail address or IP address. */
function keyOf(limit: Limit, subject: string): string {
  return createHmac("sha256", AUTH_SECRET).update(`${limit.name}\n${subject.trim().toLowerCase()}`).digest("base64url");
}

const windowStart = (limit: Limit, now: Date) => new Date(now.getTime() - limit.windowMs).toISOString();

function refusal(limit: Limit, startedAt: string, now: Date): ApiError {
  const retryAfterS = Math.max(1, Math.ceil((new Date(startedAt).getTime() + limit.windowMs - now.getTime()) / 1000));
  const minutes = Math.ceil(retryAfterS / 60);
  return new ApiError("rate_limited", `Too many ${limit.what}. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`, undefined, retryAfterS);
}

/** Counts one request against each limit and refuses (429) once any is past its maximum. */
export async function consume(checks: [Limit, string][], clock: Clock = () => new Date(), q: Db = db()): Promise<void> {
  const now = clock();
  for (const [limit, subject] of checks) {
    const counter = await hitCounter(keyOf(limit, subject), now.toISOString(), windowStart(limit, now), q);
    if (counter.count > limit.max) throw refusal(limit, counter.window_started_at, now);
  }
}

/** Refuses (429) when a limit is already reached, without counting; failures are counted by `recordFailure`. */
export async function ensureUnder(checks: [Limit, string][], clock: Clock = () => new Date(), q: Db = db()): Promise<void> {
  const now = clock();
  for (const [limit, subject] of checks) {
    const counter = await readCounter(keyOf(limit, subject), windowStart(limit, now), q);
    if (counter && counter.count >= limit.max) throw refusal(limit, counter.window_started_at, now);
  }
}

/** Counts one failure against each limit. */
export async function recordFailure(checks: [Limit, string][], clock: Clock = () => new Date(), q: Db = db()): Promise<void> {
  const now = clock();
  for (const [limit, subject] of checks) await hitCounter(keyOf(limit, subject), now.toISOString(), windowStart(limit, now), q);
}

/** A success wipes the slate for that subject (the account's failures, not the network's). */
export async function forgive(limit: Limit, subject: string, q: Db = db()): Promise<void> {
  await clearCounter(keyOf(limit, subject), q);
}

/**
 * The client's address: the last X-Forwarded-For entry, which Next.js fills from the socket
 * when nothing in front set it, and which a reverse proxy in front appends. Run behind one
 * that sets it; per-address limits are the loose ones for that reason.
 */
export function clientAddress(headers: Headers | Record<string, string | string[] | undefined>): string {
  const raw = headers instanceof Headers ? headers.get("x-forwarded-for") : headers["x-forwarded-for"];
  const value = Array.isArray(raw) ? raw.join(",") : (raw ?? "");
  const last = value.split(",").map((s) => s.trim()).filter(Boolean).pop();
  return last ?? "unknown";
}
