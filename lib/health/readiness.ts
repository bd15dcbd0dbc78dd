import "server-only";
import os from "node:os";
import { beat, beatsOf } from "@/db/heartbeats";
import { outboxFigures } from "@/db/outbox";
import { probeMail } from "@/lib/mail/transport";
import { probeMedia } from "@/lib/media/cloudinary";
import { probeStripe } from "@/lib/payments/stripe";
import { failureReason, type ProbeResult } from "./cached-probe";

// GET /api/health/ready: whether this app process can do its job right now, check by check.
// Each check is { ok, …figures }; the whole is ok only when every check is. The database
// check writes (this process's heartbeat row), so a read-only or full disk shows; the
// outside services are asked at most every few seconds (lib/health/cached-probe.ts).

// The worker beats every 10 s; a minute without one means it is stopped, stuck or cut off.
export const WORKER_STALE_S = 60;
// Mail waits in the outbox while the mail server or the worker is away; past this the
// backlog is worth someone's attention even if everything answers now (common practice, no source).
export const OUTBOX_STALE_S = 15 * 60;

export interface Check {
  ok: boolean;
  [figure: string]: unknown;
}

export interface Readiness {
  ok: boolean;
  checks: { database: Check; worker: Check; outbox: Check; mail: Check; payments: Check; media: Check };
}

const startedAt = new Date().toISOString();
const appBeatId = `app:${os.hostname()}:${process.pid}`;

const failed = (err: unknown): Check => ({ ok: false, error: failureReason(err) });

async function database(now: Date): Promise<Check> {
  const t = Date.now();
  await beat({ id: appBeatId, kind: "app", host: os.hostname(), pid: process.pid, started_at: startedAt, beat_at: now.toISOString() });
  return { ok: true, write_ms: Date.now() - t };
}

async function worker(now: Date): Promise<Check> {
  const beats = await beatsOf("worker");
  const ageOf = (at: string) => Math.max(0, Math.round((now.getTime() - new Date(at).getTime()) / 1000));
  const newest = beats[0];
  const live = beats.filter((b) => ageOf(b.beat_at) <= WORKER_STALE_S).length;
  if (!newest) return { ok: false, workers: 0, last_beat_at: null, age_s: null, max_age_s: WORKER_STALE_S, error: "no worker has reported" };
  const age = ageOf(newest.beat_at);
  return { ok: age <= WORKER_STALE_S, workers: live, last_beat_at: newest.beat_at, age_s: age, max_age_s: WORKER_STALE_S };
}

async function outbox(now: Date): Promise<Check> {
  const f = await outboxFigures(now.toISOString());
  const oldest = f.oldest_due_at ? Math.max(0, Math.round((now.getTime() - new Date(f.oldest_due_at).getTime()) / 1000)) : null;
  return { ok: oldest === null || oldest <= OUTBOX_STALE_S, pending: f.pending, waiting: f.due, failed: f.failed, oldest_age_s: oldest, max_age_s: OUTBOX_STALE_S };
}

const service = (r: ProbeResult): Check => ({ ...r });

async function settle(check: Promise<Check>): Promise<Check> {
  try {
    return await check;
  } catch (err) {
    return failed(err);
  }
}

export async function readiness(now: Date = new Date()): Promise<Readiness> {
  const [db, w, o, mail, payments, media] = await Promise.all([
    settle(database(now)),
    settle(worker(now)),
    settle(outbox(now)),
    settle(probeMail().then(service)),
    settle(probeStripe().then(service)),
    settle(probeMedia().then(service)),
  ]);
  const checks = { database: db, worker: w, outbox: o, mail, payments, media };
  return { ok: Object.values(checks).every((c) => c.ok), checks };
}
