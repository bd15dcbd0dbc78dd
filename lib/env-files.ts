// The commands Next.js does not start itself (db:*, worker, fakes) read the same .env files
// Next.js reads, in its order (.env.local before .env), without overriding what is already in
// the environment. So a variable set in .env.local means the same thing to every command:
// DATABASE_URL there switches the app, the worker and the migrations to PostgreSQL together.
// Import it first in an entry point, before anything reads process.env.
import { loadEnvConfig } from "@next/env";

loadEnvConfig(process.cwd(), process.env.NODE_ENV !== "production", { info: () => {}, error: (...args: unknown[]) => console.error(...args) });
