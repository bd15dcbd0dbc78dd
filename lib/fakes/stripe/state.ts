import { existsSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { FakeStripeState } from "./types";

// All records live in memory. When a data file is given (STRIPE_FAKE_DATA for the CLI),
// they are also written there after every change and read back at start, so restarting
// the fakes in development does not strand the app's database with unknown pi_/cs_ ids.

/**
 * Where `npm run dev` and `npm start` keep the records: STRIPE_FAKE_DATA, else beside the
 * database whose rows name them (db/duffbank.stripe-fake.json by default, gitignored), so a
 * run with its own database file (the e2e run, the benchmark) gets records of its own.
 */
export function stripeDataFile(env: Record<string, string | undefined> = process.env): string {
  if (env.STRIPE_FAKE_DATA) return path.resolve(env.STRIPE_FAKE_DATA);
  const database = env.DATABASE_FILE || path.join("db", "duffbank.sqlite");
  return path.resolve(`${database.replace(/\.(sqlite3?|db)$/, "")}.stripe-fake.json`);
}

const MAP_KEYS = [
  "checkoutSessions",
  "sessionLineItems",
  "sessionIntentTemplates",
  "paymentIntents",
  "charges",
  "refunds",
  "events",
  "idempotency",
] as const;

export function createState(): FakeStripeState {
  return {
    checkoutSessions: new Map(),
    sessionLineItems: new Map(),
    sessionIntentTemplates: new Map(),
    paymentIntents: new Map(),
    charges: new Map(),
    refunds: new Map(),
    events: new Map(),
    deliveries: [],
    idempotency: new Map(),
  };
}

export function loadState(file: string): FakeStripeState {
  const state = createState();
  if (!existsSync(file)) return state;
  const saved = JSON.parse(readFileSync(file, "utf8")) as Record<string, unknown>;
  for (const key of MAP_KEYS) {
    const entries = saved[key];
    if (Array.isArray(entries)) {
      const map = state[key] as Map<string, unknown>;
      for (const [id, value] of entries as Array<[string, unknown]>) map.set(id, value);
    }
  }
  if (Array.isArray(saved.deliveries)) state.deliveries.push(...(saved.deliveries as FakeStripeState["deliveries"]));
  return state;
}

export function saveState(state: FakeStripeState, file: string): void {
  const out: Record<string, unknown> = { deliveries: state.deliveries };
  for (const key of MAP_KEYS) out[key] = [...state[key].entries()];
  // Write then rename, so a crash mid-write never leaves half a file to load next time.
  const tmp = `${file}.tmp`;
  writeFileSync(tmp, JSON.stringify(out));
  renameSync(tmp, file);
}
