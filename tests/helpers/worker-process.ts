// The real worker (`npm run worker`) as a child process on a test's database, for tests that
// stop it with a signal or check what readiness says while it runs and after it stops.
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

const ROOT = path.resolve(__dirname, "../..");

export interface WorkerProcess {
  child: ChildProcess;
  output: () => string;
  /** Resolves with the exit code (and how long after `stop` was called it came). */
  stop(signal?: NodeJS.Signals): Promise<{ code: number | null; ms: number }>;
  exited: Promise<number | null>;
}

export function startWorkerProcess(env: Record<string, string>): WorkerProcess {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "lib/worker/run.ts"], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: "test", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  return {
    child,
    output: () => out,
    exited,
    async stop(signal = "SIGTERM") {
      const t = Date.now();
      if (child.exitCode === null) child.kill(signal);
      const code = await exited;
      return { code, ms: Date.now() - t };
    },
  };
}

/** Polls `check` every 100 ms until it holds, or fails after `ms`. */
export async function waitFor(check: () => Promise<boolean> | boolean, ms: number, what: string): Promise<void> {
  const until = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`timed out after ${ms} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
