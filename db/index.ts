import knex, { type Knex } from "knex";
import { configFor } from "../knexfile";
import { dbEnvironment } from "../lib/env";

const g = globalThis as unknown as { __duffbankDb?: Knex };

/** The one Knex instance, cached on globalThis so dev reloads do not open new pools. */
export function db(): Knex {
  if (!g.__duffbankDb) g.__duffbankDb = knex(configFor(dbEnvironment(undefined, { forTests: true })));
  return g.__duffbankDb;
}

/** Tests point services at their own fresh database. */
export function setDb(instance: Knex | undefined) {
  g.__duffbankDb = instance;
}

export type Db = Knex | Knex.Transaction;

export function newId(): string {
  return crypto.randomUUID();
}

export function nowIso(clock: () => Date = () => new Date()): string {
  return clock().toISOString();
}

/** Rows grouped by a key, keeping their order: the shape "photos of each listing" takes. */
export function groupBy<T>(rows: T[], key: (row: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const r of rows) {
    const list = out.get(key(r));
    if (list) list.push(r);
    else out.set(key(r), [r]);
  }
  return out;
}
