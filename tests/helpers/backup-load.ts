// What the backup tests share on either engine: writers that keep reserving while a backup
// runs (tests/helpers/reserve-load.ts, one process each), the figures a copy is judged by,
// and the judgement: whole transactions only, taken between the live counts before and after.
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect } from "vitest";

const ROOT = path.resolve(__dirname, "../..");

/** The figures, as SQL giving one number `n` each, the same on SQLite and PostgreSQL. */
export const FIGURE_SQL = {
  reservations: "SELECT count(*) AS n FROM reservations",
  events: "SELECT count(*) AS n FROM reservation_events",
  mail: "SELECT count(*) AS n FROM email_outbox",
  held: "SELECT coalesce(sum(quantity_held), 0) AS n FROM listings",
  heldBySum: "SELECT coalesce(sum(quantity), 0) AS n FROM reservations WHERE status = 'held'",
} as const;

export type Figures = Record<keyof typeof FIGURE_SQL, number>;

export interface Writers {
  /** Resolves once every writer has held `atLeast` in all, rejects if a writer fails first. */
  started(countNow: () => Promise<number> | number, atLeast: number): Promise<void>;
  /** Tells the writers to stop after their current reservation, and waits for their tallies. */
  stop(): Promise<{ held: number }[]>;
}

/**
 * One writer process per gardener, reserving one unit at a time on the database `env` names,
 * until told to stop. They stop on a file's appearing rather than at a time fixed before
 * they start, so a slow start on a busy machine cannot leave them no time to write.
 */
export function startWriters(listingId: string, gardenerIds: string[], env: Record<string, string>): Writers {
  const stopFile = path.join(os.tmpdir(), `duffbank-writers-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}`);
  let failure: Error | null = null;
  const done = Promise.all(
    gardenerIds.map(
      (id) =>
        new Promise<{ held: number }>((resolve, reject) => {
          const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/helpers/reserve-load.ts", listingId, id, stopFile], {
            cwd: ROOT,
            env: { ...process.env, NODE_ENV: "test", ...env },
          });
          let out = "";
          child.stdout.on("data", (d) => (out += d));
          child.stderr.on("data", (d) => process.stderr.write(d));
          child.on("exit", (code) => (code === 0 ? resolve(JSON.parse(out)) : reject(new Error(`writer exited with ${code}`))));
        }),
    ),
  );
  done.catch((err: Error) => (failure = err));
  return {
    async started(countNow, atLeast) {
      while ((await countNow()) < atLeast) {
        if (failure) throw failure;
        await new Promise((r) => setTimeout(r, 100));
      }
    },
    async stop() {
      fs.writeFileSync(stopFile, "");
      try {
        return await done;
      } finally {
        fs.rmSync(stopFile, { force: true });
      }
    },
  };
}

/** A copy taken while the writers wrote: between the live counts, and whole transactions only. */
export function expectWholeTransactions(got: Figures, before: Figures, after: Figures) {
  expect(got.reservations).toBeGreaterThanOrEqual(before.reservations);
  expect(got.reservations).toBeLessThanOrEqual(after.reservations);
  // Whole transactions only: every reservation with its history row, its two e-mails and its held unit.
  expect(got.events).toBe(got.reservations);
  expect(got.mail).toBe(2 * got.reservations);
  expect(got.held).toBe(got.reservations);
  expect(got.heldBySum).toBe(got.reservations);
}
