// Runs once when the server starts (next start, or any start of the built server), before
// it serves a request: a production start with missing or demo secrets stops here.
import { sharedEnv } from "./lib/env-shared";

export async function register() {
  if (sharedEnv().NEXT_RUNTIME !== "nodejs") return;
  const { checkStartup, readEnv } = await import("./lib/env");
  // `next build` runs with NODE_ENV=production too, but builds need no secrets.
  if (readEnv().NEXT_PHASE === "phase-production-build") return;
  checkStartup("app");
}
