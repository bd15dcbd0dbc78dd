import os from "node:os";
import path from "node:path";
import type { Knex } from "knex";
import { migrationSource } from "./db/migration-source";
import { ResilientSqliteClient } from "./db/sqlite-client";
import { pgTypes } from "./db/dialect";
import { readEnv } from "./lib/env";

// npm scripts, tests and the server all run from the project root; __dirname would point
// into the build output once Next.js bundles this file.
const root = process.cwd();

/** SQLite connections: referential integrity on, WAL so readers never block the writer. */
export function sqliteAfterCreate(conn: { pragma: (sql: string) => unknown }, done: (err: Error | null, conn: unknown) => void) {
  try {
    conn.pragma("foreign_keys = ON");
    conn.pragma("journal_mode = WAL");
    conn.pragma("busy_timeout = 5000");
    conn.pragma("synchronous = NORMAL");
    done(null, conn);
  } catch (err) {
    done(err as Error, conn);
  }
}

const migrations = { migrationSource, tableName: "knex_migrations" };

export function sqliteConfig(filename: string): Knex.Config {
  return {
    // better-sqlite3, with connections replaced after a storage fault (db/sqlite-client.ts).
    client: ResilientSqliteClient,
    connection: { filename },
    useNullAsDefault: true,
    pool: { afterCreate: sqliteAfterCreate },
    migrations,
  };
}

/**
 * PostgreSQL: the app's own type parsers on its connections (db/dialect.ts), and every
 * session in UTC so anything the server formats or truncates itself agrees with the ISO text
 * the app writes. DATABASE_POOL_MAX bounds the connections of one process: N app processes
 * and M workers open at most (N + M) × that many.
 */
export function pgConfig(url: string): Knex.Config {
  return {
    client: "pg",
    connection: { connectionString: url, types: pgTypes, options: "-c TimeZone=UTC", application_name: "duffbank" } as Knex.PgConnectionConfig,
    pool: { min: 0, max: readEnv().DATABASE_POOL_MAX ?? 10 },
    migrations,
  };
}

function sqliteFile(env: string): string {
  const file = readEnv().DATABASE_FILE;
  if (file) return file;
  // A fresh file for every test run, so no run sees another's rows.
  if (env === "test") return path.join(os.tmpdir(), `duffbank-test-${process.pid}-${Date.now()}.sqlite`);
  return path.join(root, "db", "duffbank.sqlite");
}

/**
 * The one switch: DATABASE_URL set means PostgreSQL for every command (dev, start, worker,
 * db:*, tests, bench) whatever NODE_ENV says; otherwise the SQLite file.
 */
export function configFor(env: string = readEnv().NODE_ENV ?? "development"): Knex.Config {
  const url = readEnv().DATABASE_URL;
  return url ? pgConfig(url) : sqliteConfig(sqliteFile(env));
}
