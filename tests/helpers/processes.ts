// Starting and stopping the app's own processes from a test or the bench: free ports, a
// production build (made once when missing), waiting for a URL, and stopping a process with
// everything it started.
import { spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

export const ROOT = path.resolve(__dirname, "../..");

/** A port for a server to bind, from below the ephemeral range (see free-ports.cjs). */
export { freePort, freePorts } from "./free-ports.cjs";

/** A production build to serve: the one there is, or a new one (`force`, or none yet). */
export function ensureBuild(label: string, force = false): void {
  if (fs.existsSync(path.join(ROOT, ".next", "BUILD_ID")) && !force) return;
  console.log(`[${label}] building for production first: next build (a few minutes on 2 cores)`);
  const built = spawnSync("npx", ["next", "build"], { cwd: ROOT, stdio: "inherit" });
  if (built.status !== 0) throw new Error("next build failed");
}

export async function waitFor(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`${url} did not answer within ${ms / 1000} s`);
}

/** Stops a child started with `detached: true`, and every process in its group (npm, next …). */
export function stop(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        // gone already
      }
    }, 10_000);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    process.kill(-child.pid!, "SIGTERM");
  });
}
