// Runs once when the server starts (next start, or any start of the built server), before
// it serves a request: a production start with missing or demo secrets stops here.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // `next build` runs with NODE_ENV=production too, but builds need no secrets.
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { checkStartup } = await import("./lib/env");
  checkStartup("app");
}
