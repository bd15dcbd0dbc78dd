// `npm run db:backup` while two processes keep writing, and `npm run db:restore`, on SQLite:
// the copy holds whole transactions only (its row counts agree with each other and lie
// between the live counts before and after), passes integrity_check, and a restore refuses to
// overwrite without --force and while the app or worker is alive. PostgreSQL's pg_dump and
// pg_restore: tests/integration/ops-backup-postgres.test.ts.
import { execFile } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { expectWholeTransactions, FIGURE_SQL, type Figures, startWriters } from "../helpers/backup-load";
import { createListing, createUser } from "../factories";

const exec = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const TSX = ["--conditions=react-server", "--import", "tsx"];

let ctx: Awaited<ReturnType<typeof freshDb>>;
let dir: string;

beforeAll(async () => {
  if (onPg) return;
  ctx = await freshDb({ materials: true });
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "duffbank-backup-"));
});
afterAll(async () => {
  if (onPg) return;
  await ctx.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

/** `npm run db:<command> -- <args>` as an operator runs it, against `file`. */
function dbCli(command: "backup" | "restore", args: string[], file: string) {
  return exec(process.execPath, [...TSX, "scripts/db.ts", command, ...args], { cwd: ROOT, env: { ...process.env, NODE_ENV: "test", DATABASE_FILE: file }, encoding: "utf8", timeout: 60_000 });
}

function counts(file: string): Figures {
  const c = new Database(file, { readonly: true });
  try {
    const one = (sql: string) => Number((c.prepare(sql).get() as { n: number }).n);
    return Object.fromEntries(Object.entries(FIGURE_SQL).map(([k, sql]) => [k, one(sql)])) as Figures;
  } finally {
    c.close();
  }
}

const onPg = !!process.env.DATABASE_URL;

describe.skipIf(onPg)("backing up under write load", () => {
  it("writes a consistent copy whose row counts agree and which passes integrity_check", async () => {
    const listing = await createListing({ quantity_total: 100_000 });
    const gardeners = await Promise.all([0, 1].map(() => createUser({ roles: ["gardener"] })));
    // A long read (a report, say) holds its snapshot through the load, so SQLite cannot fold
    // the -wal back into the main file: what a plain file copy would miss, the backup must not.
    const reader = new Database(ctx.file, { readonly: true });
    reader.exec("BEGIN");
    reader.prepare("SELECT count(*) FROM reservations").get();
    const writers = startWriters(listing.id, gardeners.map((g) => g.id), { DATABASE_FILE: ctx.file });
    // Let the writers get going, then back up while they write.
    await writers.started(() => counts(ctx.file).reservations, 20);
    const before = counts(ctx.file);
    const copy = path.join(dir, "under-load.sqlite");
    const { stdout } = await dbCli("backup", [copy], ctx.file);
    const after = counts(ctx.file);
    reader.exec("COMMIT");
    reader.close();
    const written = await writers.stop();

    expect(stdout).toMatch(/backed up to .*under-load\.sqlite .*reservations \d+/);
    expect(written.every((w) => w.held > 0)).toBe(true);
    expect(after.reservations).toBeGreaterThan(before.reservations); // the load really ran during the backup

    const c = new Database(copy, { readonly: true });
    expect(c.pragma("integrity_check", { simple: true })).toBe("ok");
    expect(c.pragma("journal_mode", { simple: true })).toBe("delete"); // one self-contained file
    c.close();
    expect(fs.existsSync(`${copy}-wal`)).toBe(false);

    expectWholeTransactions(counts(copy), before, after);
  }, 240_000);

  it("will not write the backup over the live database", async () => {
    await expect(dbCli("backup", [ctx.file], ctx.file)).rejects.toMatchObject({ stderr: expect.stringMatching(/over the live database/) });
  });
});

describe.skipIf(onPg)("restoring", () => {
  it("puts a backup in place of a missing database, refuses to overwrite one without --force, and keeps the one it replaces", async () => {
    const backup = path.join(dir, "restore-source.sqlite");
    await dbCli("backup", [backup], ctx.file);
    const want = counts(backup);

    const target = path.join(dir, "restored.sqlite");
    const first = await dbCli("restore", [backup], target);
    expect(first.stdout).toMatch(/restored .*restored\.sqlite/);
    expect(counts(target)).toEqual(want);

    // Something changed since; restoring over it needs --force.
    const live = new Database(target);
    live.prepare("DELETE FROM email_outbox").run();
    live.close();
    await expect(dbCli("restore", [backup], target)).rejects.toMatchObject({ stderr: expect.stringMatching(/--force/) });
    expect(counts(target).mail).toBe(0);

    const forced = await dbCli("restore", [backup, "--force"], target);
    expect(counts(target)).toEqual(want);
    const kept = forced.stdout.match(/kept as (\S+)/)?.[1];
    expect(kept).toMatch(/\S/);
    expect(fs.existsSync(kept!)).toBe(true);
    expect(counts(kept!).mail).toBe(0); // the replaced database, as it was
  }, 60_000);

  it("refuses while the app or a worker is alive, even with --force", async () => {
    const backup = path.join(dir, "restore-busy.sqlite");
    await dbCli("backup", [backup], ctx.file);
    const target = path.join(dir, "busy.sqlite");
    await dbCli("restore", [backup], target);
    const live = new Database(target);
    live.prepare("INSERT INTO heartbeats (id, kind, host, pid, started_at, beat_at) VALUES ('worker:test', 'worker', 'test', 1, ?, ?)").run(new Date().toISOString(), new Date().toISOString());
    live.close();
    await expect(dbCli("restore", [backup, "--force"], target)).rejects.toMatchObject({ stderr: expect.stringMatching(/still running: worker:test/) });
  }, 60_000);

  it("refuses a file that is not a sound Duffbank database", async () => {
    const junk = path.join(dir, "junk.sqlite");
    fs.writeFileSync(junk, "not a database at all, just text that is long enough to look like a header.".repeat(20));
    await expect(dbCli("restore", [junk], path.join(dir, "never.sqlite"))).rejects.toMatchObject({ stderr: expect.stringMatching(/not a database|integrity/) });
    expect(fs.existsSync(path.join(dir, "never.sqlite"))).toBe(false);
  }, 60_000);
});
