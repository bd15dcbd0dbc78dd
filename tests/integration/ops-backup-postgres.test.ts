// `npm run db:backup` and `npm run db:restore` on PostgreSQL (pg_dump and pg_restore in their
// custom format), the counterpart of ops-backup.test.ts: a backup taken while two processes
// keep writing holds whole transactions only (pg_dump reads one snapshot), and a restore puts
// it into an empty database, refuses to overwrite one without --force, refuses while the app
// or a worker is alive, and refuses a file that is not a dump.
import { execFile } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import type { Knex } from "knex";
import knex from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { expectWholeTransactions, FIGURE_SQL, type Figures, startWriters } from "../helpers/backup-load";
import { adminConnection, createDatabase, databaseUrl, dropDatabase, uniqueName } from "../helpers/pg-databases";
import { createListing, createUser } from "../factories";
import { pgConfig } from "@/knexfile";

const exec = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const TSX = ["--conditions=react-server", "--import", "tsx"];
const onPg = !!process.env.DATABASE_URL;

let ctx: Awaited<ReturnType<typeof freshDb>>;
let dir: string;
const made: string[] = [];

beforeAll(async () => {
  if (!onPg) return;
  ctx = await freshDb({ materials: true });
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "duffbank-pg-backup-"));
});
afterAll(async () => {
  if (!onPg) return;
  await ctx.close();
  const admin = adminConnection();
  try {
    for (const name of made) await dropDatabase(admin, name);
  } finally {
    await admin.destroy();
  }
  fs.rmSync(dir, { recursive: true, force: true });
});

/** `npm run db:<command> -- <args>` as an operator runs it, against the database at `url`. */
function dbCli(command: "backup" | "restore", args: string[], url: string) {
  return exec(process.execPath, [...TSX, "scripts/db.ts", command, ...args], { cwd: ROOT, env: { ...process.env, NODE_ENV: "test", DATABASE_URL: url }, encoding: "utf8", timeout: 60_000 });
}

/** An empty database of its own on the test server. */
async function emptyDatabase(): Promise<string> {
  const name = uniqueName(process.env.DUFFBANK_TEST_DB_PREFIX ?? "duffbank_test_");
  const admin = adminConnection();
  try {
    await createDatabase(admin, name);
  } finally {
    await admin.destroy();
  }
  made.push(name);
  return databaseUrl(name);
}

async function withDb<T>(url: string, fn: (k: Knex) => Promise<T>): Promise<T> {
  const k = knex({ ...pgConfig(url), pool: { min: 0, max: 1 } });
  try {
    return await fn(k);
  } finally {
    await k.destroy();
  }
}

const counts = (url: string): Promise<Figures> =>
  withDb(url, async (k) => {
    const out: Record<string, number> = {};
    for (const [name, sql] of Object.entries(FIGURE_SQL)) out[name] = Number((await k.raw(sql)).rows[0].n);
    return out as Figures;
  });

const liveUrl = () => (ctx.env as { DATABASE_URL: string }).DATABASE_URL;

describe.skipIf(!onPg)("backing up PostgreSQL under write load", () => {
  it("writes a dump of one moment: whole transactions only, between the counts before and after", async () => {
    const listing = await createListing({ quantity_total: 100_000 });
    const gardeners = await Promise.all([0, 1].map(() => createUser({ roles: ["gardener"] })));
    const writers = startWriters(listing.id, gardeners.map((g) => g.id), ctx.env);
    // Let the writers get going, then back up while they write.
    await writers.started(async () => (await counts(liveUrl())).reservations, 20);
    const before = await counts(liveUrl());
    const dump = path.join(dir, "under-load.dump");
    const { stdout } = await dbCli("backup", [dump], liveUrl());
    const after = await counts(liveUrl());
    const written = await writers.stop();

    expect(stdout).toMatch(/backed up to .*under-load\.dump .*reservations \d+/);
    expect(written.every((w) => w.held > 0)).toBe(true);
    expect(after.reservations).toBeGreaterThan(before.reservations); // the load really ran during the backup

    // Restored into an empty database, the dump holds what was committed at one moment.
    const copy = await emptyDatabase();
    await dbCli("restore", [dump], copy);
    expectWholeTransactions(await counts(copy), before, after);
  }, 240_000);
});

describe.skipIf(!onPg)("restoring PostgreSQL", () => {
  it("restores into an empty database, and refuses to overwrite one without --force", async () => {
    const dump = path.join(dir, "restore-source.dump");
    await dbCli("backup", [dump], liveUrl());
    const want = await counts(liveUrl());

    const target = await emptyDatabase();
    const first = await dbCli("restore", [dump], target);
    expect(first.stdout).toMatch(/restored /);
    expect(await counts(target)).toEqual(want);

    await withDb(target, (k) => k("email_outbox").delete());
    await expect(dbCli("restore", [dump], target)).rejects.toMatchObject({ stderr: expect.stringMatching(/--force/) });
    expect((await counts(target)).mail).toBe(0);
    await dbCli("restore", [dump, "--force"], target);
    expect(await counts(target)).toEqual(want);
  }, 60_000);

  it("refuses while the app or a worker is alive, even with --force", async () => {
    const dump = path.join(dir, "restore-busy.dump");
    await dbCli("backup", [dump], liveUrl());
    const target = await emptyDatabase();
    await dbCli("restore", [dump], target);
    await withDb(target, (k) => k("heartbeats").insert({ id: "worker:test", kind: "worker", host: "test", pid: 1, started_at: new Date().toISOString(), beat_at: new Date().toISOString() }));
    await expect(dbCli("restore", [dump, "--force"], target)).rejects.toMatchObject({ stderr: expect.stringMatching(/still running: worker:test/) });
  }, 60_000);

  it("refuses a file that is not a dump, and leaves the database as it was", async () => {
    const junk = path.join(dir, "junk.dump");
    fs.writeFileSync(junk, "not a dump at all, just text that is long enough to look like a header.".repeat(20));
    const target = await emptyDatabase();
    await expect(dbCli("restore", [junk], target)).rejects.toMatchObject({ stderr: expect.stringMatching(/not a pg_dump/) });
    expect(await withDb(target, (k) => k.raw("SELECT count(*) AS n FROM information_schema.tables WHERE table_schema = 'public'"))).toMatchObject({ rows: [{ n: 0 }] });
  }, 60_000);
});
