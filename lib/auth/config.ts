// The session secret. A fixed local value keeps the demo one command away; real
// deployments set NEXTAUTH_SECRET (the README says so) and the server warns without it.
export const AUTH_SECRET = process.env.NEXTAUTH_SECRET ?? "duffbank-local-demo-secret-change-me-in-production";

if (!process.env.NEXTAUTH_SECRET && process.env.NODE_ENV === "production" && !process.env.DUFFBANK_DEMO) {
  console.warn("[auth] NEXTAUTH_SECRET is not set; using the demo secret.");
}

export const SESSION_MAX_AGE_S = 30 * 24 * 60 * 60;
