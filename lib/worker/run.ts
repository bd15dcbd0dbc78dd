// The worker process started beside the app: runs each job on its interval, one at a time
// per job, and logs failures without stopping. SIGTERM or SIGINT stops it cleanly within 20 s
// (lib/worker/runner.ts).
//
// `npm run worker -- --once expire-holds [more job names]` runs the named jobs once and
// exits: with DUFFBANK_CLOCK set it is how a test (or an operator) runs a job "later" on
// a real database. It is a command on the machine, not reachable through the web app.
import "../env-files";
import fs from "node:fs";
import { db } from "@/db/index";
import { checkStartup, readEnv } from "@/lib/env";
import { jobs } from "./jobs";
import type { Clock } from "@/lib/time/clock";
import { STOP_GRACE_MS, startWorker } from "./runner";

checkStartup("worker");

// The worker's idea of "now". DUFFBANK_CLOCK fixes it; DUFFBANK_CLOCK_FILE (set only by the
// end-to-end run) is read on every tick so a test can move time forward. Neither is set in
// production, where this is the system clock.
const clock: Clock = () => {
  const { DUFFBANK_CLOCK, DUFFBANK_CLOCK_FILE: file } = readEnv();
  if (file && fs.existsSync(file)) {
    const t = new Date(fs.readFileSync(file, "utf8").trim());
    if (!Number.isNaN(t.getTime())) return t;
  }
  return DUFFBANK_CLOCK ? new Date(DUFFBANK_CLOCK) : new Date();
};
// The end-to-end run ticks every job quickly; normal runs use each job's own interval.
const INTERVAL_OVERRIDE_MS = readEnv().WORKER_INTERVAL_MS ?? 0;

async function once(names: string[]) {
  for (const name of names) {
    const job = jobs.find((j) => j.name === name);
    if (!job) throw new Error(`no job called ${name}; jobs: ${jobs.map((j) => j.name).join(", ")}`);
    console.log(`[worker] ${name}: ${JSON.stringify(await job.run({ clock }))}`);
  }
}

const onceAt = process.argv.indexOf("--once");
if (onceAt >= 0) {
  once(process.argv.slice(onceAt + 1))
    .then(() => process.exit(0))
    .catch((err) => {
      console.error("[worker]", (err as Error).message);
      process.exit(1);
    });
} else {
  const worker = startWorker({ jobs, clock, intervalOverrideMs: INTERVAL_OVERRIDE_MS });
  let signalled = false;
  for (const sig of ["SIGINT", "SIGTERM"] as const) {
    process.on(sig, () => {
      // A second signal means "now": the claims left behind run out within minutes.
      if (signalled) process.exit(1);
      signalled = true;
      console.log(`[worker] ${sig}: finishing what is in hand (at most ${STOP_GRACE_MS / 1000} s)`);
      void worker
        .stop()
        .then(async ({ clean }) => {
          await db()
            .destroy()
            .catch(() => undefined);
          process.exit(clean ? 0 : 1);
        })
        .catch(() => process.exit(1));
    });
  }
}
