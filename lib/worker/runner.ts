// The worker's loop machinery: each job on its own interval, one run at a time per job, a
// heartbeat row while it lives, and a bounded, clean stop. Stopping (SIGTERM on a deploy,
// Ctrl-C) takes no new work, lets the runs in progress finish for up to STOP_GRACE_MS,
// writes the outbox marks still owed, lets go of every outbox claim it holds except on a
// message still in the SMTP server's hands, and removes its heartbeat, so another worker
// carries on at once instead of waiting for claims to run out.
import { setMaxListeners } from "node:events";
import os from "node:os";
import { setTimeout as sleep } from "node:timers/promises";
import { beat, pruneBeats, removeBeat } from "@/db/heartbeats";
import { releaseClaims } from "@/db/outbox";
import { markAccepted, messagesInFlight } from "@/lib/mail/deliver-outbox";
import type { Job } from "./jobs";
import type { Clock } from "@/lib/time/clock";

export const STOP_GRACE_MS = 20_000;
export const HEARTBEAT_EVERY_MS = 10_000;
// A worker row not refreshed for a day belongs to a process that is long gone.
const FORGET_BEATS_AFTER_MS = 24 * 3_600_000;

export interface WorkerOptions {
  jobs: Job[];
  clock: Clock;
  /** The end-to-end run ticks every job quickly; 0 uses each job's own interval. */
  intervalOverrideMs?: number;
  log?: (line: string) => void;
}

export interface RunningWorker {
  id: string;
  /** Resolves once every loop has ended and the worker has let go of what it held. */
  stop(graceMs?: number): Promise<{ clean: boolean }>;
}

export function workerId(): string {
  return `worker:${os.hostname()}:${process.pid}:${Math.random().toString(36).slice(2, 8)}`;
}

export function startWorker(opts: WorkerOptions): RunningWorker {
  const id = workerId();
  const log = opts.log ?? ((line) => console.log(line));
  const stopping = new AbortController();
  // Every loop naps on this one signal, and the jobs pass it on: more listeners than Node's default warning allows.
  setMaxListeners(4 * (opts.jobs.length + 1), stopping.signal);
  const startedAt = new Date().toISOString();

  const nap = (ms: number) => sleep(ms, undefined, { signal: stopping.signal }).catch(() => undefined);

  async function loop(job: Job) {
    while (!stopping.signal.aborted) {
      try {
        await job.run({ clock: opts.clock, signal: stopping.signal, workerId: id });
      } catch (err) {
        console.error(`[worker] ${job.name} failed:`, (err as Error).message);
      }
      await nap(opts.intervalOverrideMs || job.everyMs);
    }
  }

  async function heartbeat() {
    while (!stopping.signal.aborted) {
      try {
        const now = new Date();
        await beat({ id, kind: "worker", host: os.hostname(), pid: process.pid, started_at: startedAt, beat_at: now.toISOString() });
        await pruneBeats(new Date(now.getTime() - FORGET_BEATS_AFTER_MS).toISOString());
      } catch (err) {
        console.error("[worker] heartbeat failed:", (err as Error).message);
      }
      await nap(HEARTBEAT_EVERY_MS);
    }
  }

  const loops = [heartbeat(), ...opts.jobs.map(loop)];
  log(`[worker] ${id} running ${opts.jobs.map((j) => j.name).join(", ")}`);

  return {
    id,
    async stop(graceMs = STOP_GRACE_MS) {
      stopping.abort();
      let timer: NodeJS.Timeout | undefined;
      const finished = await Promise.race([
        Promise.allSettled(loops).then(() => true),
        new Promise<false>((r) => {
          timer = setTimeout(() => r(false), graceMs);
        }),
      ]);
      clearTimeout(timer);
      let clean = finished;
      try {
        await markAccepted();
        const released = await releaseClaims(id, messagesInFlight());
        await removeBeat(id);
        log(`[worker] ${id} stopped${finished ? "" : " (a run was still going at the deadline)"}; released ${released} outbox claim(s)`);
      } catch (err) {
        clean = false;
        console.error("[worker] could not let go of its claims:", (err as Error).message);
      }
      return { clean };
    },
  };
}
