import { createRequire } from "node:module";
import path from "node:path";
import type Client_BetterSQLite3Type from "knex/lib/dialects/better-sqlite3";
import { errorKind } from "./dialect";

// Loaded from node_modules when the process runs, never bundled: knex is an external package
// of the Next.js server, and bundling this one file of it would drag in every other dialect.
// The module name is built at run time so the bundler leaves the require alone.
const runtimeRequire = createRequire(path.join(process.cwd(), "package.json"));
const Client_BetterSQLite3 = runtimeRequire(["knex", "lib", "dialects", "better-sqlite3"].join("/")) as typeof Client_BetterSQLite3Type;

// Knex's better-sqlite3 client, changed in one way: a connection that meets storage gone
// read-only, unopenable or failing is marked for replacement, so the pool opens a fresh one
// on the next query and the app heals as soon as the storage is back, with no restart.
// (A connection opened while the file could not be written stays read-only for good; one
// whose file went away keeps failing. Reads keep working on it until a write shows the fault.)
// Knex's pool drops a connection whose __knex__disposed is set, the same mark its PostgreSQL
// client puts on a connection that errored.

/**
 * Whether an error from better-sqlite3 means this connection will not recover by itself:
 * storage gone read-only, unopenable or failing, or the handle closed (db/dialect.ts says which).
 */
export function isBrokenSqliteConnection(err: unknown): boolean {
  const kind = errorKind(err);
  return kind === "read_only" || kind === "connection";
}

/** Statements kept per connection; the app sends a few hundred distinct ones. */
const STATEMENT_CACHE = 500;

interface Preparing {
  prepare: (sql: string) => unknown;
}

/**
 * Keep each connection's prepared statements. Knex prepares every query afresh, and for a
 * browse page's few queries SQLite's parsing and planning cost more than running them.
 * A kept statement stays right across schema changes: SQLite prepares it again by itself.
 */
export function cacheStatements<C extends Preparing>(connection: C, size: number = STATEMENT_CACHE): C {
  const prepare = connection.prepare.bind(connection);
  const kept = new Map<string, unknown>();
  connection.prepare = (sql: string) => {
    let statement = kept.get(sql);
    if (statement) {
      // Most recently used last, so the first key is the one to drop.
      kept.delete(sql);
    } else {
      statement = prepare(sql);
      if (kept.size >= size) kept.delete(kept.keys().next().value!);
    }
    kept.set(sql, statement);
    return statement;
  };
  return connection;
}

export class ResilientSqliteClient extends Client_BetterSQLite3 {
  async acquireRawConnection(): Promise<unknown> {
    return cacheStatements((await super.acquireRawConnection()) as Preparing);
  }

  async _query(connection: unknown, obj: unknown): Promise<unknown> {
    try {
      return await super._query(connection, obj);
    } catch (err) {
      if (connection && isBrokenSqliteConnection(err)) (connection as { __knex__disposed?: unknown }).__knex__disposed = err;
      throw err;
    }
  }
}
