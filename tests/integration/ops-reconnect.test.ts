// A connection whose storage went read-only or that was closed under it is replaced on the
// next query, so the app heals once the storage is back, without a restart. Faults are made
// in-process (the tests run as root, whom file permissions do not stop): PRAGMA query_only
// makes SQLite answer every write with SQLITE_READONLY, as a connection opened during a
// read-only moment does for good; and a connection closed outright. On PostgreSQL the fault
// is the server ending the session (a restart, a failover, an administrator).
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import type { Knex } from "knex";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { GET as ready } from "@/app/api/health/ready/route";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeEach(async () => {
  ctx = await freshDb();
});
afterEach(async () => ctx.close());

type RawConn = { pragma(sql: string): unknown; close(): void };

/** The pool's one SQLite connection, to break it the way the storage would. */
async function withConnection(db: Knex, fn: (c: RawConn) => void) {
  const conn = (await db.client.acquireConnection()) as RawConn;
  try {
    fn(conn);
  } finally {
    await db.client.releaseConnection(conn);
  }
}

const write = (db: Knex, id: string) =>
  db("heartbeats").insert({ id, kind: "app", host: "test", pid: 1, started_at: new Date().toISOString(), beat_at: new Date().toISOString() });

const onPg = !!process.env.DATABASE_URL;

describe.skipIf(onPg)("a SQLite connection that breaks", () => {
  it("is replaced after SQLITE_READONLY, and the next write goes through", async () => {
    await withConnection(ctx.db, (c) => c.pragma("query_only = ON"));
    await expect(write(ctx.db, "a")).rejects.toMatchObject({ code: "SQLITE_READONLY" });
    await write(ctx.db, "b");
    expect(await ctx.db("heartbeats").pluck("id")).toEqual(["b"]);
  });

  it("is replaced when it was closed", async () => {
    await withConnection(ctx.db, (c) => c.close());
    await expect(write(ctx.db, "a")).rejects.toThrow(/not open/);
    await write(ctx.db, "b");
    expect(await ctx.db("heartbeats").pluck("id")).toEqual(["b"]);
  });

  it("shows in readiness as a failing database check, and readiness recovers by itself", async () => {
    await withConnection(ctx.db, (c) => c.pragma("query_only = ON"));
    const down = await call(ready, await request("/api/health/ready"));
    expect(down.status).toBe(503);
    expect(down.json.ok).toBe(false);
    expect(down.json.checks.database).toMatchObject({ ok: false, error: expect.stringMatching(/SQLITE_READONLY/) });
    const again = await call(ready, await request("/api/health/ready"));
    expect(again.json.checks.database).toMatchObject({ ok: true });
  });
});

describe.skipIf(!onPg)("a PostgreSQL connection that the server ends", () => {
  /** Ends every session of the pool from outside, as a server restart or a failover would. */
  async function endSessions(db: Knex) {
    const pids: number[] = [];
    const conn = await db.client.acquireConnection();
    try {
      const { rows } = await db.raw("SELECT pg_backend_pid() AS pid").connection(conn);
      pids.push(rows[0].pid);
    } finally {
      await db.client.releaseConnection(conn);
    }
    const other = ctx.connect();
    try {
      for (const pid of pids) await other.raw("SELECT pg_terminate_backend(?)", [pid]);
    } finally {
      await other.destroy();
    }
    await new Promise((r) => setTimeout(r, 200)); // the closed socket reaches the pool
  }

  it("is replaced, and the next write goes through", async () => {
    await write(ctx.db, "a");
    await endSessions(ctx.db);
    await write(ctx.db, "b").catch(() => write(ctx.db, "b")); // at most the first query sees the end
    expect((await ctx.db("heartbeats").pluck("id")).sort()).toEqual(["a", "b"]);
  });

  it("leaves readiness passing on the next check", async () => {
    await call(ready, await request("/api/health/ready"));
    await endSessions(ctx.db);
    await call(ready, await request("/api/health/ready")).catch(() => null);
    const again = await call(ready, await request("/api/health/ready"));
    expect(again.json.checks.database).toMatchObject({ ok: true });
  });
});
