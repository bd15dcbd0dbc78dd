// Starter cultures sold by the pack, through the routes a client calls: a grower lists one
// per pack, the listing answers with its pack, a gardener reserves whole packs and is charged
// packs × the pack price (not the rounded price per kg), anything but whole packs is a 422
// that holds nothing, and the match buys whole packs.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { createUser, listingBody, listingQuantities } from "../factories";
import { db } from "@/db/index";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const listings = await import("@/app/api/listings/route");
const one = await import("@/app/api/listings/[id]/route");
const reservations = await import("@/app/api/reservations/route");
const match = await import("@/app/api/match/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;
let grower = "";
let gardener = "";

// Far from the demo town, so only this file's listings are near.
const SPOT = { lat: 48.5, lng: 3.2 };

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  pay = await startPayments();
  grower = (await createUser({ roles: ["grower"] })).id;
  gardener = (await createUser({ roles: ["gardener"] })).id;
});
afterAll(async () => {
  await pay.close();
  await ctx.close();
});

const culture = (overrides: Record<string, unknown> = {}) =>
  listingBody({
    material: "worms",
    unit: "kg",
    title: "Starter packs of red wigglers",
    quantity: 3,
    quality: { species: "Eisenia fetida", ships: false, pickup: true },
    location: SPOT,
    pack_size: 0.5,
    pack_price_cents: 1450,
    ...overrides,
  });

async function createCulture(overrides: Record<string, unknown> = {}) {
  const res = await call(listings.POST as never, await request("/api/listings", { as: grower, body: culture(overrides) }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return res.json.listing.id as string;
}
const detail = async (id: string) => (await call(one.GET as never, await request(`/api/listings/${id}`, { method: "GET" }), { id })).json.listing;
const patch = async (id: string, body: unknown) => call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: grower, body }), { id });
const reserve = async (listing_id: string, quantity: number) => call(reservations.POST as never, await request("/api/reservations", { as: gardener, body: { listing_id, quantity } }));

describe("listing a culture by the pack", () => {
  it("keeps the pack and works out the price per kg from it", async () => {
    const id = await createCulture();
    const l = await detail(id);
    expect(l.pack).toEqual({ size: 0.5, price_cents: 1450 });
    // €14.50 for 0.5 kg is €29.00 a kg, whatever price_cents the client sent (0 here).
    expect(l.price_cents).toBe(2900);
  });

  it("says so of a listing priced per unit", async () => {
    const res = await call(listings.POST as never, await request("/api/listings", { as: grower, body: culture({ pack_size: null, pack_price_cents: null, price_cents: 3000 }) }));
    expect(res.status).toBe(201);
    expect((await detail(res.json.listing.id)).pack).toBeNull();
  });

  const BAD: [string, Record<string, unknown>, string, RegExp][] = [
    ["a pack on leaves", { material: "leaves", unit: "bags", quality: { leaf_source: "garden" } }, "pack_size", /Only live cultures/],
    ["a pack weight without a price", { pack_price_cents: null }, "pack_price_cents", /price of one pack/],
    ["a pack price without a weight", { pack_size: null }, "pack_size", /pack's weight/],
    ["a pack heavier than the whole listing", { quantity: 0.4 }, "pack_size", /at least one whole pack/],
    ["a free pack", { pack_price_cents: 0 }, "pack_price_cents", /choose free/],
    ["a cap that is not whole packs", { max_per_reservation: 1.2 }, "max_per_reservation", /whole packs/],
    ["a pack weighed finer than a gram", { pack_size: 0.2505 }, "pack_size", /gram/],
    ["a pack of nothing", { pack_size: 0 }, "pack_size", /more than 0/],
  ];
  for (const [label, overrides, field, message] of BAD) {
    it(`422 for ${label}, with a message on ${field}`, async () => {
      const res = await call(listings.POST as never, await request("/api/listings", { as: grower, body: culture(overrides) }));
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(message);
    });
  }

  it("can move between per pack and per kg, and the price per kg follows the pack", async () => {
    const id = await createCulture();
    expect((await patch(id, { pack_price_cents: 1600 })).status).toBe(200);
    expect(await detail(id)).toMatchObject({ pack: { size: 0.5, price_cents: 1600 }, price_cents: 3200 });
    expect((await patch(id, { pack_size: null, pack_price_cents: null, price_cents: 3500 })).status).toBe(200);
    expect(await detail(id)).toMatchObject({ pack: null, price_cents: 3500 });
    const half = await patch(id, { pack_size: 0.25 });
    expect(half.status).toBe(422);
    expect(half.json.error.fields.pack_price_cents).toMatch(/price of one pack/);
  });
});

describe("reserving whole packs", () => {
  it("charges the packs at the pack price", async () => {
    // 0.3 kg packs at €10.00 are €33.33 a kg, rounded. Thirty packs (9 kg) cost €300.00;
    // 9 × €33.33 would charge €299.97.
    const id = await createCulture({ quantity: 9, pack_size: 0.3, pack_price_cents: 1000 });
    expect((await detail(id)).price_cents).toBe(3333);
    const res = await reserve(id, 9);
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    const row = await db()("reservations").first("amount_cents", "quantity").where({ id: res.json.reservation.id });
    expect(row.amount_cents).toBe(30000);
    expect(Number(row.quantity)).toBe(9);
    const payment = await db()("payments").first("amount_cents", "kind").where({ reservation_id: res.json.reservation.id });
    expect(payment).toMatchObject({ kind: "payment", amount_cents: 30000 });
    expect(typeof res.json.checkout_url).toBe("string");
  });

  it("takes a pack weighed to the gram, finer than the usual two decimals", async () => {
    const id = await createCulture({ pack_size: 0.125, pack_price_cents: 600 });
    const res = await reserve(id, 0.375);
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect((await db()("reservations").first("amount_cents").where({ id: res.json.reservation.id })).amount_cents).toBe(1800);
  });

  it("422 for part of a pack, naming the pack, and holds nothing", async () => {
    const id = await createCulture();
    const res = await reserve(id, 0.7);
    expect(res.status).toBe(422);
    expect(res.json.error.fields.quantity).toMatch(/whole packs of 0\.5 kg/);
    expect((await listingQuantities(id)).quantity_held).toBe(0);
  });

  it("counts only whole packs as left", async () => {
    const id = await createCulture({ quantity: 1.2 });
    const res = await reserve(id, 1.5);
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("insufficient_quantity");
    // 1.2 kg holds two whole 0.5 kg packs: 1 kg.
    expect(res.json.error.message).toMatch(/Only 1 kg/);
  });
});

describe("matching with a culture sold by the pack", () => {
  it("buys enough whole packs, priced by the pack", async () => {
    // Away from the other cultures of this file, so it is the only one in reach.
    const alone = { lat: SPOT.lat - 1, lng: SPOT.lng };
    const id = await createCulture({ quantity: 5, pack_size: 0.5, pack_price_cents: 1200, location: alone });
    const res = await call(match.POST as never, await request("/api/match", { body: { needs: [{ material: "worms", quantity: 0.7, unit: "kg" }], origin: alone, radius_km: 5 } }));
    expect(res.status).toBe(200);
    const a = res.json.allocations.find((x: { listing_id: string }) => x.listing_id === id);
    expect(a).toMatchObject({ packs: 2, listing_quantity: 1, cost_cents: 2400 });
    expect(res.json.unmet).toEqual([]);
  });
});
