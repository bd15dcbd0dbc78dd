import type { Knex } from "knex";

// A transaction that reads before it writes can meet SQLITE_BUSY when another process (the
// worker beside the app) committed in between: SQLite will not upgrade a stale read
// snapshot to a write. Running the whole transaction again from the start is the cure;
// the callback must therefore only touch the database.
const BUSY = /SQLITE_BUSY|database is locked/;

export async function writeTransaction<T>(q: Knex, fn: (trx: Knex.Transaction) => Promise<T>, attempts = 6): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await q.transaction(fn);
    } catch (err) {
      const e = err as { code?: string; message?: string };
      if (i >= attempts || !(BUSY.test(e?.code ?? "") || BUSY.test(e?.message ?? ""))) throw err;
      await new Promise((r) => setTimeout(r, 10 * 2 ** i + Math.random() * 10));
    }
  }
}

/** A unique or primary-key violation, on SQLite or PostgreSQL. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; message?: string };
  return e?.code === "SQLITE_CONSTRAINT_PRIMARYKEY" || e?.code === "SQLITE_CONSTRAINT_UNIQUE" || e?.code === "23505" || /UNIQUE constraint failed/.test(e?.message ?? "");
}
