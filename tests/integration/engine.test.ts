// What must hold on both engines alike, checked on whichever this run uses (npm test runs the
// integration suite once on SQLite and once on PostgreSQL): rows come back with the types
// db/types.ts declares, quantities add up exactly, text sorts as bytes whatever the server's
// collation, errors are classified the same way, and a transaction that loses a deadlock is
// run again by writeTransaction.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Knex } from "knex";
import { freshDb } from "../helpers/db";
import { engineName, isPg } from "../helpers/engine";
import { createBed, createListing, createUser, listingQuantities } from "../factories";
import { errorKind, isForeignKeyViolation, isUniqueViolation } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { membersOf } from "@/db/organisations";
import { reserveListings } from "@/lib/services/reservations/reserve-listing";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb({ materials: true });
});
afterAll(() => ctx.close());

const ISO_MS = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;

describe(`rows on ${engineName()} have the types db/types.ts declares`, () => {
  it("a calendar date is YYYY-MM-DD text, timestamps ISO text with milliseconds", async () => {
    const u = await createUser();
    const created = "2026-03-01T09:15:30.123Z";
    await createBed({ owner_id: u.id, name: "Types", start_date: "2026-03-01", created_at: created });
    const bed = await ctx.db("beds").first("start_date", "created_at").where({ owner_id: u.id });
    expect(bed).toEqual({ start_date: "2026-03-01", created_at: created });
    // Computed in SQL too: COALESCE over two timestamps is a timestamp.
    const [row] = await ctx.db("beds").select(ctx.db.raw("COALESCE(created_at, updated_at) AS at")).where({ owner_id: u.id });
    expect(row.at).toBe(created);
    expect(row.at).toMatch(ISO_MS);
  });

  it("counts, sums and averages are numbers", async () => {
    const l = await createListing({ quantity_total: 7, unit: "m3" });
    const [agg] = await ctx.db("listings").where({ id: l.id }).count({ n: "*" }).sum({ total: "quantity_total" }).avg({ mean: "quantity_total" }).max({ top: "price_cents" });
    expect(agg).toEqual({ n: 1, total: 7, mean: 7, top: 0 });
  });

  it("keeps no 4-byte real column: every quantity is a double", async () => {
    const reals = isPg(ctx.db)
      ? (await ctx.db.raw("SELECT table_name, column_name FROM information_schema.columns WHERE table_schema = current_schema() AND data_type = 'real'")).rows
      : []; // SQLite's REAL is always 8 bytes
    expect(reals).toEqual([]);
  });
});

describe(`quantities on ${engineName()}`, () => {
  // Decimal fractions that binary floating point cannot hold exactly (0.1, 0.7, 1.1, 2.2, 3.3)
  // must still add up: in 4-byte floats 0.1 + 0.6 exceeds 0.7 and the second hold is refused.
  it.each([
    [3.3, [1.1, 2.2]],
    [0.7, [0.1, 0.6]],
  ])("holds all of a %s m³ listing in parts %j", async (total, parts) => {
    const l = await createListing({ quantity_total: total, unit: "m3", auto_accept: true });
    const g = await createUser({ roles: ["gardener"] });
    for (const quantity of parts) {
      await reserveListings({ gardenerId: g.id, items: [{ listing_id: l.id, quantity }], fieldPrefix: () => "" });
    }
    const q = await listingQuantities(l.id);
    expect(q.quantity_total).toBe(total);
    expect(Math.abs(q.quantity_held - total)).toBeLessThan(1e-12);
    const [{ sum }] = await ctx.db("reservations").where({ listing_id: l.id }).sum({ sum: "quantity" });
    expect(Math.abs(sum - total)).toBeLessThan(1e-12);
    // Nothing left: the listing has turned "gone", and one more hold is refused.
    expect((await ctx.db("listings").first("status").where({ id: l.id })).status).toBe("gone");
    await expect(reserveListings({ gardenerId: g.id, items: [{ listing_id: l.id, quantity: 0.1 }], fieldPrefix: () => "" })).rejects.toMatchObject({ code: "insufficient_quantity" });
  });
});

describe(`text order on ${engineName()}`, () => {
  it("sorts names as bytes, as SQLite does, whatever the server's collation", async () => {
    const owner = await createUser({ roles: ["council"] });
    const names = ["alice", "Bob", "_zed", "Émile", "a-b", "ab", "Zoë", "1st"];
    for (const name of names) {
      await createUser({ roles: ["council"], organisation_id: owner.organisation_id, display_name: name });
    }
    await ctx.db("memberships").where({ user_id: owner.id }).delete();
    const got = (await membersOf(owner.organisation_id!)).map((m) => m.name);
    const bytes = [...names].sort((a, b) => Buffer.compare(Buffer.from(a), Buffer.from(b)));
    expect(got).toEqual(bytes);
  });
});

describe(`errors on ${engineName()}`, () => {
  it("are told apart: unique, foreign key, check", async () => {
    const u = await createUser();
    const dup = await ctx.db("users").insert({ id: u.id, email: "dup@example.test", display_name: "x", unit_system: "metric", created_at: "2026-01-01T00:00:00.000Z", updated_at: "2026-01-01T00:00:00.000Z" }).catch((e) => e);
    expect(isUniqueViolation(dup)).toBe(true);
    const fk = await ctx.db("user_roles").insert({ user_id: "nobody", role: "gardener", status: "active", created_at: "2026-01-01T00:00:00.000Z" }).catch((e) => e);
    expect(isForeignKeyViolation(fk)).toBe(true);
    const l = await createListing({ quantity_total: 2, unit: "m3" });
    const check = await ctx.db("listings").where({ id: l.id }).update({ quantity_held: 5 }).catch((e) => e);
    expect(errorKind(check)).toBe("check");
    expect(errorKind(new Error("something else"))).toBeNull();
  });
});

// PostgreSQL only: on SQLite one process cannot hold two write transactions at once (the
// second handle would wait synchronously for the first, stalling the thread that must finish
// it); SQLITE_BUSY between processes is what the concurrency tests cover.
describe.skipIf(!process.env.DATABASE_URL)("a transaction that loses a deadlock on PostgreSQL", () => {
  it("is run again by writeTransaction until it gets through", async () => {
    const a = await createListing({ quantity_total: 10, unit: "m3" });
    const b = await createListing({ quantity_total: 10, unit: "m3" });
    // Two sessions lock the same two rows in opposite orders; the server breaks the deadlock
    // by failing one of them (40P01), and writeTransaction runs that one again.
    const conns = [ctx.connect(), ctx.connect()];
    let attempts = 0;
    try {
      const bump = (conn: Knex, first: string, second: string) =>
        writeTransaction(conn, async (trx) => {
          attempts++;
          await trx("listings").where({ id: first }).increment("quantity_held", 1);
          await new Promise((r) => setTimeout(r, 150)); // both hold their first row now
          await trx("listings").where({ id: second }).increment("quantity_held", 1);
        });
      await Promise.all([bump(conns[0], a.id, b.id), bump(conns[1], b.id, a.id)]);
    } finally {
      await Promise.all(conns.map((c) => c.destroy()));
    }
    expect((await listingQuantities(a.id)).quantity_held).toBe(2);
    expect((await listingQuantities(b.id)).quantity_held).toBe(2);
    expect(attempts).toBe(3);
  });
});
