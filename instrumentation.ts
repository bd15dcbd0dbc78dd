// Runs once when the server starts (next start, or any start of the built server), before
// it serves a request: a production start with missing or demo secrets stops here.
export async function register() {
  // The one read of the environment outside lib/env*.ts: Next.js writes NEXT_RUNTIME into this
  // file per bundle only when it is spelled out here, so the Edge build drops the import below
  // (lib/env.ts calls process.exit, which Edge lacks). Through a helper it would stay in.
  // eslint-disable-next-line no-restricted-properties
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { checkStartup, readEnv } = await import("./lib/env");
  // `next build` runs with NODE_ENV=production too, but builds need no secrets.
  if (readEnv().NEXT_PHASE === "phase-production-build") return;
  checkStartup("app");
}
