// Averaging cannot find a pickup place: every listing (and giveaway day) one owner posts at one
// place shows the same public point, still within the stated band of the exact point; and the
// migration moves points stored under the earlier per-listing offsets onto that one point.
import { distance, point } from "@turf/turf";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createGiveaway, createUser, listingBody } from "../factories";
import { APPROX_MAX_M, APPROX_MIN_M } from "@/lib/geo/approximate";
import * as placeKeyed from "@/migrations/20261202_008_place_keyed_offsets";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const listings = await import("@/app/api/listings/route");
const one = await import("@/app/api/listings/[id]/route");
const giveaways = await import("@/app/api/giveaways/route");

const SHOP = { lat: 52.21871, lng: 0.83954 };
const SHOP_ADDRESS = "Unit 3, Tanyard Row, Fernhollow";
const metres = (a: { lat: number; lng: number }, b: { lat: number; lng: number }) => distance(point([a.lng, a.lat]), point([b.lng, b.lat]), { units: "meters" });

let ctx: Awaited<ReturnType<typeof freshDb>>;
let shop = "";
let neighbour = "";
const posted: string[] = [];

async function post(as: string, body: Record<string, unknown>) {
  const res = await call(listings.POST as never, await request("/api/listings", { as, body: listingBody(body) }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return res.json.listing.id as string;
}

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  shop = (await createUser({ roles: ["supplier"] })).id;
  neighbour = (await createUser({ roles: ["supplier"] })).id;
  // A shop listing flat boxes every week for a year from one address.
  for (let week = 0; week < 52; week++) {
    posted.push(
      await post(shop, {
        material: "cardboard",
        unit: "sheets",
        quantity: 20,
        title: `Flat boxes, week ${week + 1}`,
        description: "Plain brown boxes, tape and staples taken off.",
        quality: { tape_removed: true, no_glossy_print: true },
        location: SHOP,
        address: SHOP_ADDRESS,
      }),
    );
  }
});
afterAll(() => ctx.close());

describe("many listings at one address", () => {
  it("show one public point, in browse and on every detail, within the stated band", async () => {
    const res = await call(listings.GET as never, await request(`/api/listings?lat=${SHOP.lat}&lng=${SHOP.lng}&radius_km=3&limit=100`));
    expect(res.status).toBe(200);
    const mine = (res.json.items as { id: string; location: { lat: number; lng: number } }[]).filter((i) => posted.includes(i.id));
    expect(mine).toHaveLength(posted.length);
    const points = new Set(mine.map((i) => JSON.stringify(i.location)));
    for (const id of posted.slice(0, 10)) {
      const detail = await call(one.GET as never, await request(`/api/listings/${id}`), { id });
      points.add(JSON.stringify(detail.json.listing.location));
    }
    expect(points.size).toBe(1);

    // The average of every point shown is exactly as far from the shop as any one of them.
    const shown = mine.map((i) => i.location);
    const averaged = { lat: shown.reduce((s, p) => s + p.lat, 0) / shown.length, lng: shown.reduce((s, p) => s + p.lng, 0) / shown.length };
    const m = metres(SHOP, averaged);
    expect(m).toBeGreaterThanOrEqual(APPROX_MIN_M - 1);
    expect(m).toBeLessThanOrEqual(APPROX_MAX_M + 1);
  });

  it("shows another owner at the same address a point of their own", async () => {
    const theirs = await post(neighbour, { location: SHOP, address: SHOP_ADDRESS });
    const [a, b] = await ctx.db("listings").whereIn("id", [posted[0], theirs]).orderByRaw(`id = ? desc`, [posted[0]]).select("approx_lat", "approx_lng");
    expect([b.approx_lat, b.approx_lng]).not.toEqual([a.approx_lat, a.approx_lng]);
    expect(metres(SHOP, { lat: b.approx_lat, lng: b.approx_lng })).toBeGreaterThanOrEqual(APPROX_MIN_M - 1);
  });

  it("keeps the shared point when a listing's pin is moved away and back", async () => {
    const before = await ctx.db("listings").where({ id: posted[0] }).first("approx_lat", "approx_lng");
    const moved = await call(one.PATCH as never, await request(`/api/listings/${posted[1]}`, { as: shop, method: "PATCH", body: { location: { lat: 52.2301, lng: 0.8702 } } }), { id: posted[1] });
    expect(moved.status, JSON.stringify(moved.json)).toBe(200);
    const away = await ctx.db("listings").where({ id: posted[1] }).first("approx_lat", "approx_lng");
    expect(away).not.toEqual(before);
    const back = await call(one.PATCH as never, await request(`/api/listings/${posted[1]}`, { as: shop, method: "PATCH", body: { location: SHOP } }), { id: posted[1] });
    expect(back.status).toBe(200);
    expect(await ctx.db("listings").where({ id: posted[1] }).first("approx_lat", "approx_lng")).toEqual(before);
  });
});

describe("giveaway days at one depot", () => {
  it("show one public point for every day a council holds there", async () => {
    const council = (await createUser({ roles: ["council"] })).id;
    const DEPOT = { lat: 52.20877, lng: 0.85566 };
    const days: Awaited<ReturnType<typeof createGiveaway>>[] = [];
    for (let i = 0; i < 6; i++) days.push(await createGiveaway(council, { location: DEPOT, title: `Leaf day ${i + 1}` }));
    const res = await call(giveaways.GET as never, await request(`/api/giveaways?lat=${DEPOT.lat}&lng=${DEPOT.lng}&radius_km=3`));
    const shown = (res.json.items as { id: string; location: { lat: number; lng: number } }[]).filter((i) => days.some((d) => d.id === i.id));
    expect(shown).toHaveLength(days.length);
    expect(new Set(shown.map((i) => JSON.stringify(i.location))).size).toBe(1);
    const m = metres(DEPOT, shown[0].location);
    expect(m).toBeGreaterThanOrEqual(APPROX_MIN_M - 1);
    expect(m).toBeLessThanOrEqual(APPROX_MAX_M + 1);
  });
});

describe("migration 20261202_008_place_keyed_offsets", () => {
  it("moves points stored per listing and per day onto the place's one point", async () => {
    const shared = await ctx.db("listings").where({ id: posted[0] }).first("approx_lat", "approx_lng");
    // Rows as the earlier code stored them: a different point for each listing and day.
    for (const [i, id] of posted.slice(0, 5).entries()) {
      await ctx.db("listings").where({ id }).update({ approx_lat: SHOP.lat + 0.003 * (i + 1), approx_lng: SHOP.lng - 0.002 * i });
    }
    const dayIds = (await ctx.db("giveaway_days").select("id")).map((d) => d.id as string);
    const dayPoint = await ctx.db("giveaway_days").where({ id: dayIds[0] }).first("approx_lat", "approx_lng");
    for (const [i, id] of dayIds.entries()) await ctx.db("giveaway_days").where({ id }).update({ approx_lat: 52.1 + i * 0.001, approx_lng: 0.8 });

    await placeKeyed.up(ctx.db);

    const rows = await ctx.db("listings").whereIn("id", posted).select("approx_lat", "approx_lng");
    expect(rows.every((r) => r.approx_lat === shared.approx_lat && r.approx_lng === shared.approx_lng)).toBe(true);
    const days = await ctx.db("giveaway_days").whereIn("id", dayIds).select("approx_lat", "approx_lng");
    expect(days).toEqual(dayIds.map(() => dayPoint));
  });
});
