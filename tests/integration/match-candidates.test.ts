import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { destination } from "@turf/turf";
import { freshDb } from "../helpers/db";
import { isPg, queryPlan } from "../helpers/engine";
import { prng } from "@/seeds/ids";
import { createListing, createUser } from "../factories";
import { databaseSource, findCandidates, findCheapest, nearestListings } from "@/db/match-candidates";
import { boundingBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";
import { searchListings } from "@/db/listing-search";
import { EARTH_POINT_FUNCTION } from "@/db/dialect";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let owner: string;
beforeAll(async () => {
  ctx = await freshDb({ seed: true });
  owner = (await createUser({ roles: ["supplier"] })).id;
});
afterAll(() => ctx.close());

/** Every statement the block sends, with its query plan. */
async function plansOf(fn: () => Promise<unknown>) {
  const seen: { sql: string; bindings: unknown[] }[] = [];
  const listener = (q: { sql: string; bindings: unknown[] }) => seen.push(q);
  ctx.db.on("query", listener);
  try {
    await fn();
  } finally {
    ctx.db.removeListener("query", listener);
  }
  return Promise.all(
    seen.filter((q) => /from [`"]?listing(s|_points)\b/i.test(q.sql)).map(async (q) => ({ sql: q.sql, plan: await queryPlan(ctx.db, q.sql, q.bindings) })),
  );
}

/**
 * PostgreSQL plans from statistics and reads a table of a few dozen rows whole, index or
 * not: give it a county's worth of listings around the origin (gone again afterwards).
 */
async function crowd(origin: { lat: number; lng: number }, count: number): Promise<() => Promise<void>> {
  const r = prng(17);
  const kinds = [["leaves", "bags", 0.1136], ["straw", "bales", 0.1487], ["worms", "kg", null], ["cardboard", "sheets", 0.8], ["compost", "m3", null]] as const;
  const ids: string[] = [];
  const rows = Array.from({ length: count }, (_, i) => {
    const [material_code, unit, unit_size] = kinds[i % kinds.length];
    const approx = { lat: origin.lat + (r() - 0.5) * 0.9, lng: origin.lng + (r() - 0.5) * 1.4 };
    const id = crypto.randomUUID();
    ids.push(id);
    return { id, owner_id: owner, material_code, unit, unit_size, title: `Crowd ${i}`, description: "", status: r() < 0.9 ? "active" : "paused", quantity_total: 10, price_cents: Math.floor(r() * 900), lat: approx.lat, lng: approx.lng, address: `${i} Crowd Lane`, approx_lat: approx.lat, approx_lng: approx.lng, created_at: new Date().toISOString(), updated_at: new Date().toISOString() };
  });
  await ctx.db.batchInsert("listings", rows, 500);
  await ctx.db.raw("ANALYZE listings");
  return async () => {
    for (let i = 0; i < ids.length; i += 500) await ctx.db("listings").whereIn("id", ids.slice(i, i + 500)).delete();
  };
}

describe("candidate queries", () => {
  const origin = { lat: 52.205, lng: 0.847 };
  it("never scan the listings table: each goes through the spatial index or the price index", async () => {
    const src = databaseSource(ctx.db);
    const uncrowd = isPg(ctx.db) ? await crowd(origin, 5_000) : async () => {};
    try {
      const plans = await plansOf(async () => {
        await findCandidates({ origin, radius_km: 10, materials: ["leaves", "straw"] }, ctx.db);
        await findCheapest({ origin, radius_km: 10, materials: ["straw"], limit: 24 }, ctx.db);
        await src.inBox(["worms"], boundingBox(origin, 3), origin, 2000);
        await nearestListings({ origin, radius_km: 10, materials: ["leaves"], limit: 5 }, ctx.db);
      });
      expect(plans.length).toBeGreaterThanOrEqual(4);
      for (const p of plans) {
        if (isPg(ctx.db)) {
          // The spatial index (status, material, point in space) finds every box and ring;
          // the price-ordered queries have the price index (or the B-tree box) to choose from.
          const spatial = p.sql.includes(EARTH_POINT_FUNCTION);
          expect(p.plan, p.sql).toMatch(spatial ? /(Index Scan using|Bitmap Index Scan on) listings_near/ : /(Index Scan using|Bitmap Index Scan on) listings_(unit_price|search_box)/);
          expect(p.plan, p.sql).not.toMatch(/Seq Scan on listings/);
        } else {
          // A box is read from the R*Tree, then each listing in it by its key; the price order from its index.
          expect(p.plan, p.sql).toMatch(/SCAN listing_points VIRTUAL TABLE INDEX \d+:.*SEARCH listings USING INDEX sqlite_autoindex_listings_1 \(id=\?\)|SEARCH listings USING INDEX listings_unit_price/);
          expect(p.plan, p.sql).not.toMatch(/SCAN listings|TEMP B-TREE/);
        }
      }
    } finally {
      await uncrowd();
    }
  });

  it("browse near a point goes through an index too (the spatial one on PostgreSQL)", async () => {
    const uncrowd = isPg(ctx.db) ? await crowd(origin, 5_000) : async () => {};
    try {
      const plans = await plansOf(() => searchListings({ point: origin, radiusKm: 25, now: new Date().toISOString() }, null, 20, ctx.db));
      expect(plans.length).toBeGreaterThanOrEqual(1);
      for (const p of plans) {
        if (isPg(ctx.db)) expect(p.plan, p.sql).toMatch(/(Index Scan using|Bitmap Index Scan on) listings_near/);
        else expect(p.plan, p.sql).toMatch(/SCAN listing_points VIRTUAL TABLE INDEX \d+:.*SEARCH listings USING INDEX sqlite_autoindex_listings_1 \(id=\?\)/);
        expect(p.plan, p.sql).not.toMatch(/Seq Scan on listings|SCAN listings\b/);
      }
    } finally {
      await uncrowd();
    }
  });

  it("find the same nearest listings as measuring every one", async () => {
    const all = (await ctx.db("listings").where({ status: "active" }).select("id", "approx_lat", "approx_lng"))
      .map((r: any) => ({ id: r.id, d: distanceKm(origin, { lat: r.approx_lat, lng: r.approx_lng }) }))
      .sort((a: any, b: any) => a.d - b.d);
    const near = await nearestListings({ origin, radius_km: 20, materials: ["cardboard", "leaves", "straw", "worms", "grass_clippings", "coffee_grounds", "wood_chips", "manure", "compost"], limit: 7 }, ctx.db);
    expect(near.map((c) => c.id)).toEqual(all.slice(0, 7).map((x: any) => x.id));
  });

  it("list the cheapest per unit size first, and say when they stopped short", async () => {
    const got = await findCheapest({ origin, radius_km: 15, materials: ["straw"], limit: 3 }, ctx.db);
    const perSize = got.rows.map((c) => c.price_cents / (c.unit_size ?? 1));
    expect(perSize).toEqual([...perSize].sort((a, b) => a - b));
    // Stopped at the limit: the price it stopped at is no cheaper than any it returned.
    expect(got.last_unit_price).toBeGreaterThanOrEqual(Math.max(...perSize));
    const everything = await findCheapest({ origin, radius_km: 15, materials: ["straw"], limit: 1000 }, ctx.db);
    expect(everything.last_unit_price).toBeNull();
    expect(Math.min(...everything.rows.map((c) => c.price_cents / (c.unit_size ?? 1)))).toBeGreaterThanOrEqual(perSize[0] - 1e-9);
  });

  it("never drop a listing inside the radius, however close to its edge (fast-check)", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.record({ lat: fc.double({ min: -60, max: 60, noNaN: true }), lng: fc.double({ min: -170, max: 170, noNaN: true }) }),
        fc.double({ min: 0.2, max: 200, noNaN: true }),
        fc.array(fc.record({ bearing: fc.double({ min: -180, max: 180, noNaN: true }), edge: fc.double({ min: 0.995, max: 1.005, noNaN: true }) }), { minLength: 1, maxLength: 12 }),
        async (centre, km, points) => {
          const ids: string[] = [];
          for (const p of points) {
            const [lng, lat] = destination([centre.lng, centre.lat], km * p.edge, p.bearing, { units: "kilometers" }).geometry.coordinates;
            ids.push((await createListing({ owner_id: owner, material_code: "compost", unit: "m3", location: { lat, lng } })).id);
          }
          try {
            const found = new Set((await findCandidates({ origin: centre, radius_km: km, materials: ["compost"] }, ctx.db)).map((c) => c.id));
            const rows = await ctx.db("listings").whereIn("id", ids).select("id", "approx_lat", "approx_lng");
            for (const r of rows) {
              const inside = distanceKm(centre, { lat: r.approx_lat, lng: r.approx_lng }) <= km;
              if (inside !== found.has(r.id)) return false;
            }
            return true;
          } finally {
            await ctx.db("listings").whereIn("id", ids).delete();
          }
        },
      ),
      { numRuns: 60 },
    );
  });
});
