// `npm run db:backup -- <file>` and `npm run db:restore -- <file> [--force]`.
//
// SQLite: the online backup API copies the live database page by page into a temporary file
// in one step after the first, from a single read snapshot, so writers carry on and the copy
// is exactly one committed state (copying the file itself while the app runs is not: it
// tears pages and misses what still sits in the -wal file). The copy is checked
// (integrity_check), switched to a plain single-file journal, and moved into place.
// PostgreSQL: pg_dump in its custom format, and pg_restore.
//
// A restore puts a backup back with the app and the worker stopped: it refuses while any of
// them beat in the last BUSY_WITHIN_S seconds, refuses to overwrite a database without
// --force, and keeps the database it replaces beside it (<file>.before-restore-<time>).
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import knex, { type Knex } from "knex";

export const BUSY_WITHIN_S = 30;

export type TableCounts = Record<string, number>;

export interface BackupResult {
  file: string;
  bytes: number;
  tables: TableCounts;
}

type Engine = { kind: "sqlite"; file: string } | { kind: "pg"; url: string };

export function engineOf(config: Knex.Config): Engine {
  if (config.client === "pg") {
    const c = config.connection as string | { connectionString?: string };
    return { kind: "pg", url: typeof c === "string" ? c : String(c.connectionString) };
  }
  return { kind: "sqlite", file: (config.connection as { filename: string }).filename };
}

// ---- SQLite -------------------------------------------------------------------------

function sqliteTables(conn: Database.Database): TableCounts {
  const rows = conn.prepare("SELECT name, sql FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name").all() as { name: string; sql: string }[];
  // A full-text index is a virtual table kept in shadow tables of its own (<name>_data …):
  // neither is data of ours to count; the rows it indexes are counted in their own table.
  const virtual = rows.filter((r) => /^CREATE VIRTUAL TABLE/i.test(r.sql)).map((r) => r.name);
  const real = rows.map((r) => r.name).filter((n) => !virtual.some((v) => n === v || n.startsWith(`${v}_`)));
  return Object.fromEntries(real.map((n) => [n, Number(conn.prepare(`SELECT count(*) FROM "${n.replaceAll('"', '""')}"`).pluck().get())]));
}

/** integrity_check on a database file, and what it holds; throws when it is not a sound Duffbank database. */
export function checkSqliteFile(file: string): TableCounts {
  const conn = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const result = conn.pragma("integrity_check", { simple: true });
    if (result !== "ok") throw new Error(`${file} failed integrity_check: ${String(result)}`);
    const tables = sqliteTables(conn);
    if (!("knex_migrations" in tables)) throw new Error(`${file} is not a Duffbank database (no knex_migrations table)`);
    return tables;
  } finally {
    conn.close();
  }
}

function samePath(a: string, b: string): boolean {
  const real = (p: string) => (fs.existsSync(p) ? fs.realpathSync(p) : path.resolve(p));
  return real(a) === real(b);
}

export async function backupSqlite(source: string, dest: string): Promise<BackupResult> {
  if (!fs.existsSync(source)) throw new Error(`there is no database at ${source}`);
  if (samePath(source, dest)) throw new Error("the backup cannot be written over the live database");
  const tmp = `${dest}.partial-${process.pid}`;
  fs.rmSync(tmp, { force: true });
  const live = new Database(source, { fileMustExist: true });
  try {
    live.pragma("busy_timeout = 5000");
    // After the first step, everything in one: one read snapshot, never restarted by a writer.
    await live.backup(tmp, { progress: () => 0x7fffffff });
  } finally {
    live.close();
  }
  try {
    const copy = new Database(tmp);
    try {
      // A backup is one self-contained file: no -wal beside it to lose.
      copy.pragma("journal_mode = DELETE");
    } finally {
      copy.close();
    }
    const tables = checkSqliteFile(tmp);
    const fd = fs.openSync(tmp, "r");
    fs.fsyncSync(fd);
    fs.closeSync(fd);
    fs.renameSync(tmp, dest);
    return { file: dest, bytes: fs.statSync(dest).size, tables };
  } catch (err) {
    fs.rmSync(tmp, { force: true });
    throw err;
  }
}

/** Processes that said they were alive within BUSY_WITHIN_S seconds. */
function recentBeatsSqlite(file: string, now: Date): { id: string; beat_at: string }[] {
  const conn = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const has = conn.prepare("SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = 'heartbeats'").get();
    if (!has) return [];
    return conn.prepare("SELECT id, beat_at FROM heartbeats WHERE beat_at > ?").all(new Date(now.getTime() - BUSY_WITHIN_S * 1000).toISOString()) as { id: string; beat_at: string }[];
  } finally {
    conn.close();
  }
}

function refuseWhileRunning(beats: { id: string; beat_at: string }[]) {
  if (beats.length === 0) return;
  const who = beats.map((b) => `${b.id} (last seen ${b.beat_at})`).join(", ");
  throw new Error(`the app or the worker is still running: ${who}. Stop them all first, wait ${BUSY_WITHIN_S} seconds, and run the restore again.`);
}

export async function restoreSqlite(backup: string, target: string, opts: { force: boolean; now?: Date }): Promise<BackupResult & { keptAs: string | null }> {
  if (!fs.existsSync(backup)) throw new Error(`there is no backup at ${backup}`);
  if (samePath(backup, target)) throw new Error("the backup is the live database itself");
  const tables = checkSqliteFile(backup);
  let keptAs: string | null = null;
  if (fs.existsSync(target)) {
    if (!opts.force) throw new Error(`${target} exists; restoring would overwrite it. Run again with --force to replace it (it is kept beside as a copy).`);
    refuseWhileRunning(recentBeatsSqlite(target, opts.now ?? new Date()));
    // Whatever the live file still has in its -wal goes into the copy kept aside.
    keptAs = `${target}.before-restore-${(opts.now ?? new Date()).toISOString().replace(/[:.]/g, "-")}`;
    const current = new Database(target, { fileMustExist: true });
    try {
      current.pragma("busy_timeout = 0");
      // Nobody may be writing: an exclusive lock now would fail if anyone held one.
      current.exec("BEGIN EXCLUSIVE; COMMIT;");
      await current.backup(keptAs, { progress: () => 0x7fffffff });
      current.pragma("wal_checkpoint(TRUNCATE)");
    } finally {
      current.close();
    }
  }
  const tmp = `${target}.restoring-${process.pid}`;
  fs.copyFileSync(backup, tmp);
  for (const f of [target, `${target}-wal`, `${target}-shm`]) fs.rmSync(f, { force: true });
  fs.renameSync(tmp, target);
  const restored = new Database(target);
  try {
    restored.pragma("journal_mode = WAL");
  } finally {
    restored.close();
  }
  return { file: target, bytes: fs.statSync(target).size, tables, keptAs };
}

// ---- PostgreSQL ---------------------------------------------------------------------

function run(command: string, args: string[], quiet = false): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ["ignore", quiet ? "ignore" : "inherit", quiet ? "ignore" : "inherit"] });
    child.on("error", (err) => reject(new Error(`${command} could not start (${err.message}); install the PostgreSQL client tools`)));
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${command} exited with ${code}`))));
  });
}

async function pgTables(conn: Knex): Promise<TableCounts> {
  const names: string[] = await conn("information_schema.tables").where({ table_schema: "public", table_type: "BASE TABLE" }).orderBy("table_name").pluck("table_name");
  const out: TableCounts = {};
  for (const n of names) out[n] = Number((await conn(n).count<{ n: string }[]>({ n: "*" }))[0].n);
  return out;
}

export async function backupPg(url: string, dest: string): Promise<BackupResult> {
  const tmp = `${dest}.partial-${process.pid}`;
  // Custom format: compressed, and pg_restore can pick tables from it. pg_dump reads one snapshot.
  await run("pg_dump", ["--format=custom", "--file", tmp, "--dbname", url]);
  fs.renameSync(tmp, dest);
  const conn = knex({ client: "pg", connection: url });
  try {
    return { file: dest, bytes: fs.statSync(dest).size, tables: await pgTables(conn) };
  } finally {
    await conn.destroy();
  }
}

export async function restorePg(url: string, backup: string, opts: { force: boolean; now?: Date }): Promise<BackupResult & { keptAs: null }> {
  if (!fs.existsSync(backup)) throw new Error(`there is no backup at ${backup}`);
  await run("pg_restore", ["--list", backup], true).catch(() => {
    throw new Error(`${backup} is not a pg_dump custom-format file`);
  });
  const conn = knex({ client: "pg", connection: url });
  try {
    const existing = await pgTables(conn);
    if (Object.keys(existing).length > 0) {
      if (!opts.force) throw new Error("the database has tables; restoring would overwrite them. Run again with --force to replace them.");
      if ("heartbeats" in existing) {
        const since = new Date((opts.now ?? new Date()).getTime() - BUSY_WITHIN_S * 1000).toISOString();
        refuseWhileRunning(await conn("heartbeats").select("id", "beat_at").where("beat_at", ">", since));
      }
    }
    await run("pg_restore", ["--clean", "--if-exists", "--no-owner", "--single-transaction", "--exit-on-error", "--dbname", url, backup]);
    return { file: url.replace(/:[^:@/]*@/, ":***@"), bytes: fs.statSync(backup).size, tables: await pgTables(conn), keptAs: null };
  } finally {
    await conn.destroy();
  }
}

// ---- Either -------------------------------------------------------------------------

export async function backupDatabase(config: Knex.Config, dest: string): Promise<BackupResult> {
  const engine = engineOf(config);
  const file = path.resolve(dest);
  return engine.kind === "pg" ? backupPg(engine.url, file) : backupSqlite(engine.file, file);
}

export async function restoreDatabase(config: Knex.Config, backup: string, opts: { force: boolean }) {
  const engine = engineOf(config);
  const file = path.resolve(backup);
  return engine.kind === "pg" ? restorePg(engine.url, file, opts) : restoreSqlite(file, engine.file, opts);
}
