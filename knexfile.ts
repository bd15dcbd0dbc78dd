import os from "node:os";
import path from "node:path";
import type { Knex } from "knex";
import { migrationSource } from "./db/migration-source";
import { ResilientSqliteClient } from "./db/sqlite-client";

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

function sqlite(filename: string): Knex.Config {
  return {
    // better-sqlite3, with connections replaced after a storage fault (db/sqlite-client.ts).
    client: ResilientSqliteClient,
    connection: { filename },
    useNullAsDefault: true,
    pool: { afterCreate: sqliteAfterCreate },
    migrations: { migrationSource, tableName: "knex_migrations" },
  };
}

const config: Record<string, Knex.Config> = {
  development: sqlite(process.env.DATABASE_FILE ?? path.join(root, "db", "duffbank.sqlite")),
  // A fresh file for every test run, so no run sees another's rows.
  test: sqlite(process.env.DATABASE_FILE ?? path.join(os.tmpdir(), `duffbank-test-${process.pid}-${Date.now()}.sqlite`)),
  production: process.env.DATABASE_URL
    ? {
        client: "pg",
        connection: process.env.DATABASE_URL,
        pool: { min: 0, max: 10 },
        migrations: { migrationSource, tableName: "knex_migrations" },
      }
    : sqlite(process.env.DATABASE_FILE ?? path.join(root, "db", "duffbank.sqlite")),
};

export function configFor(env: string = process.env.NODE_ENV ?? "development"): Knex.Config {
  return config[env] ?? config.development;
}

export default config;
