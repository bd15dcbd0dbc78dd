import type { Knex } from "knex";
import { isRetryable } from "./dialect";

// A transaction that reads before it writes can fail for reasons that running it again from
// the start cures: on SQLite, SQLITE_BUSY when another process (the worker beside the app)
// committed in between, since SQLite will not upgrade a stale read snapshot to a write; on
// PostgreSQL, a serialisation failure (40001) or a deadlock (40P01) between two transactions
// locking the same rows in a different order. The callback must therefore only touch the
// database (Stripe calls and e-mails go after the commit).
export async function writeTransaction<T>(q: Knex, fn: (trx: Knex.Transaction) => Promise<T>, attempts = 6): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await q.transaction(fn);
    } catch (err) {
      if (i >= attempts || !isRetryable(err)) throw err;
      await new Promise((r) => setTimeout(r, 10 * 2 ** i + Math.random() * 10));
    }
  }
}
