// The worker process started beside the app: runs each job on its interval, one at a time
// per job, and logs failures without stopping.
import { jobs, type Clock } from "./jobs";

const clock: Clock = () => (process.env.DUFFBANK_CLOCK ? new Date(process.env.DUFFBANK_CLOCK) : new Date());
let stopping = false;

async function loop(job: (typeof jobs)[number]) {
  while (!stopping) {
    try {
      await job.run(clock);
    } catch (err) {
      console.error(`[worker] ${job.name} failed:`, (err as Error).message);
    }
    await new Promise((r) => setTimeout(r, job.everyMs));
  }
}

console.log(`[worker] running ${jobs.map((j) => j.name).join(", ")}`);
for (const job of jobs) void loop(job);

for (const sig of ["SIGINT", "SIGTERM"] as const) {
  process.on(sig, () => {
    stopping = true;
    process.exit(0);
  });
}
