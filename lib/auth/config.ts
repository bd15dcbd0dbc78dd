import { secret } from "@/lib/env";

// The session secret. The demo value keeps `npm run dev` one command away; a production
// start without a real NEXTAUTH_SECRET is refused before anything is served (lib/env.ts).
export const AUTH_SECRET = secret("NEXTAUTH_SECRET");

export const SESSION_MAX_AGE_S = 30 * 24 * 60 * 60;
