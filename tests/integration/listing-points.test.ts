import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { createListing, createUser } from "../factories";
import { nearestListings } from "@/db/match-candidates";
import { searchListings } from "@/db/listing-search";
import { isPg } from "@/db/dialect";

// The spatial index (SQLite's R*Tree, migrations/20261208_016_listing_points.ts; GiST on
// PostgreSQL) follows every change of a listing's public point: a search never misses a
// listing that moved in, nor finds one that moved away or was deleted.

let ctx: Awaited<ReturnType<typeof freshDb>>;
let owner: string;
beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  owner = (await createUser({ roles: ["supplier"] })).id;
});
afterAll(() => ctx.close());

const here = { lat: 52.205, lng: 0.847 };
const far = { lat: 53.5, lng: -1.2 };
const near = (origin = here) => nearestListings({ origin, radius_km: 5, materials: ["leaves"], limit: 10 }, ctx.db).then((c) => c.map((x) => x.id));
const browse = (origin = here) =>
  searchListings({ point: origin, radiusKm: 5, now: new Date().toISOString() }, null, 10, ctx.db).then((rows) => rows.map((r) => r.id));
/** Points in SQLite's R*Tree (PostgreSQL's index is not a table to count: the searches below tell). */
const indexed = async () => (isPg(ctx.db) ? 0 : Number((await ctx.db.raw("SELECT count(*) AS n FROM listing_points"))[0].n));

describe("the listings' spatial index", () => {
  it("holds each listing inserted, follows its point when it moves, and lets go when it is deleted", async () => {
    const before = await indexed();
    const id = (await createListing({ owner_id: owner, material_code: "leaves", unit: "m3", location: here })).id;
    if (!isPg(ctx.db)) expect(await indexed()).toBe(before + 1);
    expect(await near()).toContain(id);
    expect(await browse()).toContain(id);

    await ctx.db("listings").where({ id }).update({ approx_lat: far.lat, approx_lng: far.lng });
    expect(await near()).not.toContain(id);
    expect(await browse()).not.toContain(id);
    expect(await near(far)).toContain(id);
    expect(await browse(far)).toContain(id);

    await ctx.db("listings").where({ id }).del();
    expect(await indexed()).toBe(before);
    expect(await near(far)).not.toContain(id);
    if (!isPg(ctx.db)) expect(Number((await ctx.db.raw("SELECT count(*) AS n FROM listing_point_keys WHERE listing_id = ?", [id]))[0].n)).toBe(0);
  });

  it("finds a listing a hair inside the edge of the box, although the index rounds its floats", async () => {
    // 5 km due north is the box's edge; a point 1 m inside it must be found, one 1 m outside not.
    const edge = here.lat + 5 / 111.195;
    const inside = (await createListing({ owner_id: owner, material_code: "leaves", unit: "m3", location: { lat: edge - 1e-5, lng: here.lng } })).id;
    const outside = (await createListing({ owner_id: owner, material_code: "leaves", unit: "m3", location: { lat: edge + 1e-5, lng: here.lng } })).id;
    const found = await nearestListings({ origin: here, radius_km: 5, materials: ["leaves"], limit: 100 }, ctx.db);
    expect(found.map((c) => c.id)).toContain(inside);
    expect(found.map((c) => c.id)).not.toContain(outside);
  });
});
