// What tests ask of the database engine itself, the same on SQLite and PostgreSQL: the
// tables there are, whether foreign keys are enforced, how a query is planned, a trigger
// that refuses a write (to inject a fault), and a second connection. Tests never read sqlite_master, PRAGMA
// or EXPLAIN QUERY PLAN directly; they call these.
import { execFileSync } from "node:child_process";
import path from "node:path";
import Database from "better-sqlite3";
import type { Knex } from "knex";
import { isPg } from "@/db/dialect";

export { isPg };

/** The engine a test file runs on, for its titles and the rare engine-specific expectation. */
export const engineName = () => (process.env.DATABASE_URL ? "PostgreSQL" : "SQLite");

/** User tables (not Knex's own, not SQLite's internal or FTS shadow tables). */
export async function tableNames(db: Knex): Promise<string[]> {
  if (isPg(db)) {
    const { rows } = await db.raw(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' AND table_name NOT LIKE 'knex\\_%'",
    );
    return rows.map((r: { name: string }) => r.name).sort();
  }
  const rows = await db.raw("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'knex\\_%' ESCAPE '\\' AND name NOT LIKE 'sqlite\\_%' ESCAPE '\\'");
  // An FTS5 table keeps its data in shadow tables named after it.
  const names: string[] = rows.map((r: { name: string }) => r.name);
  return names.filter((n) => !names.some((base) => n !== base && n.startsWith(`${base}_`) && /_(data|idx|content|docsize|config)$/.test(n))).sort();
}

/** Whether the connection enforces foreign keys (always on PostgreSQL; a PRAGMA on SQLite). */
export async function foreignKeysEnforced(db: Knex): Promise<boolean> {
  if (isPg(db)) return true;
  const [{ foreign_keys }] = await db.raw("PRAGMA foreign_keys");
  return foreign_keys === 1;
}

/**
 * The plan of a query as one line of text: SQLite's EXPLAIN QUERY PLAN details, PostgreSQL's
 * EXPLAIN. `sql` and `bindings` as Knex's "query" event gives them ($1, $2 … on PostgreSQL).
 */
export async function queryPlan(db: Knex, sql: string, bindings: readonly unknown[] = []): Promise<string> {
  if (isPg(db)) {
    const { rows } = await db.raw(`EXPLAIN ${sql.replace(/\$\d+/g, "?")}`, bindings as Knex.RawBinding[]);
    return rows.map((r: { "QUERY PLAN": string }) => r["QUERY PLAN"].trim()).join("; ");
  }
  const rows = await db.raw(`EXPLAIN QUERY PLAN ${sql}`, bindings as Knex.RawBinding[]);
  return rows.map((r: { detail: string }) => r.detail).join("; ");
}

/**
 * A trigger that fails every `event` on `table` whose row matches `when` (SQL over NEW.* or
 * OLD.* columns) with `message`, for tests that need a write to fail. Returns its removal.
 */
export async function refuseWrites(db: Knex, o: { name: string; table: string; event: "INSERT" | "UPDATE" | "DELETE"; when: string; message: string }): Promise<() => Promise<void>> {
  const msg = o.message.replace(/'/g, "''");
  if (isPg(db)) {
    await db.raw(`CREATE FUNCTION ${o.name}() RETURNS trigger AS $$ BEGIN RAISE EXCEPTION '${msg}'; END; $$ LANGUAGE plpgsql`);
    await db.raw(`CREATE TRIGGER ${o.name} BEFORE ${o.event} ON ${o.table} FOR EACH ROW WHEN (${o.when}) EXECUTE FUNCTION ${o.name}()`);
    return async () => {
      await db.raw(`DROP TRIGGER ${o.name} ON ${o.table}`);
      await db.raw(`DROP FUNCTION ${o.name}()`);
    };
  }
  await db.raw(`CREATE TRIGGER ${o.name} BEFORE ${o.event} ON ${o.table} WHEN ${o.when} BEGIN SELECT RAISE(ABORT, '${msg}'); END`);
  return async () => {
    await db.raw(`DROP TRIGGER ${o.name}`);
  };
}

/**
 * A second connection to the test's database whose statements run synchronously, so a test
 * can change a row in the middle of a query hook, before the app's next statement is sent,
 * and the end-to-end tests can read rows between clicks. `?` placeholders on both engines.
 * SQLite: better-sqlite3 on the same file. PostgreSQL: a short-lived Node process per
 * statement (tests/helpers/sql-once.ts; a synchronous client does not exist), committed
 * before the call returns.
 */
export interface OtherConnection {
  all<T = any>(sql: string, params?: unknown[]): T[];
  run(sql: string, params?: unknown[]): void;
  close(): void;
}

const ROOT = path.resolve(__dirname, "../..");

export function otherConnection(env: { DATABASE_FILE: string } | { DATABASE_URL: string }): OtherConnection {
  if ("DATABASE_URL" in env) {
    const all = <T,>(sql: string, params: unknown[] = []): T[] => {
      const out = execFileSync(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(ROOT, "tests/helpers/sql-once.ts")], {
        cwd: ROOT,
        input: JSON.stringify({ url: env.DATABASE_URL, sql, params }),
        stdio: ["pipe", "pipe", "inherit"],
        encoding: "utf8",
      });
      return JSON.parse(out) as T[];
    };
    return { all, run: (sql, params) => void all(sql, params), close() {} };
  }
  const conn = new Database(env.DATABASE_FILE);
  conn.pragma("busy_timeout = 5000");
  return {
    all: <T,>(sql: string, params: unknown[] = []) => conn.prepare(sql).all(...params) as T[],
    run(sql, params = []) {
      conn.prepare(sql).run(...params);
    },
    close() {
      conn.close();
    },
  };
}
