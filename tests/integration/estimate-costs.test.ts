import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser } from "../factories";
import { FERNHOLLOW } from "../helpers/match";
import * as estimateRoute from "@/app/api/estimate/route";

// Prices here are invented for the test; the sums are by hand.
let ctx: Awaited<ReturnType<typeof freshDb>>;
const ids: Record<string, string> = {};

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  const supplier = (await createUser({ roles: ["supplier"] })).id;
  const grower = (await createUser({ roles: ["grower"] })).id;
  const near = { lat: FERNHOLLOW.lat + 0.002, lng: FERNHOLLOW.lng + 0.002 };
  ids.board = (await createListing({ owner_id: supplier, material_code: "cardboard", unit: "sheets", unit_size: 0.8, quantity_total: 40, price_cents: 0, deposit_cents: 0, location: near })).id;
  ids.leaves = (await createListing({ owner_id: supplier, material_code: "leaves", unit: "bags", unit_size: 0.1136, quantity_total: 20, price_cents: 0, deposit_cents: 300, location: near })).id;
  ids.straw = (await createListing({ owner_id: supplier, material_code: "straw", unit: "bales", unit_size: 0.1487, unit_mass_kg: 20, quantity_total: 10, price_cents: 450, deposit_cents: 500, location: near })).id;
  ids.worms = (await createListing({ owner_id: grower, material_code: "worms", unit: "kg", quantity_total: 5, price_cents: 2800, deposit_cents: 0, location: near, quality: { species: "Eisenia fetida" } })).id;
  ids.hidden = (await createListing({ owner_id: supplier, material_code: "leaves", unit: "bags", unit_size: 0.1136, quantity_total: 20, price_cents: 0, status: "hidden", location: near })).id;
});
afterAll(() => ctx.close());

const post = async (body: unknown) => call(estimateRoute.POST as never, await request("/api/estimate", { body }));
// 3 × 1.2 m: 3.6 m² of bed, 0.45 m³ leaves (4 bags), 0.18 m³ straw (1 bale), 1.8 kg of worms.
const bed = { length_m: 3, width_m: 1.2 };

describe("POST /api/estimate with a plan's prices", () => {
  it("adds up free material, deposits held and paid items from the listings' own prices", async () => {
    const res = await post({
      bed,
      start_date: "2027-03-01",
      plan: { items: [{ listing_id: ids.board, quantity: 8 }, { listing_id: ids.leaves, quantity: 4 }, { listing_id: ids.straw, quantity: 1 }, { listing_id: ids.worms, quantity: 1.8 }] },
    });
    expect(res.status).toBe(200);
    // Kept every field an estimate has, and added costs.
    expect(res.json).toHaveProperty("needs");
    expect(res.json).toHaveProperty("water_l");
    const c = res.json.costs;
    // Paid: 1 bale × €4.50 + 1.8 kg × €28.00 = 450 + 5,040 = 5,490 cents. A priced listing asks
    // no deposit, so the straw's €5 deposit is not held; the free leaves hold their €3.
    expect(c.totals).toEqual([{ currency: "eur", to_pay_cents: 5490, deposits_cents: 300, free_pickups: 1, deposit_pickups: 1, paid_pickups: 2 }]);
    expect(c.lines.map((l: any) => [l.material, l.kind, l.cost_cents, l.deposit_cents])).toEqual([
      ["cardboard", "free", 0, 0],
      ["leaves", "deposit", 0, 300],
      ["straw", "paid", 450, 0],
      ["worms", "paid", 5040, 0],
    ]);
    // The worm line's price, before anything is reserved.
    expect(c.by_material.find((m: any) => m.material === "worms")).toMatchObject({ cost_cents: 5040, currency: "eur" });
    // 8 sheets × 0.8 m² = 6.4 m² ≥ the cardboard the bed takes; everything else covered too.
    expect(c.unmet).toEqual([]);
  });

  it("says what hand-picked pickups leave uncovered", async () => {
    const res = await post({ bed, start_date: "2027-03-01", plan: { items: [{ listing_id: ids.leaves, quantity: 2 }] } });
    const unmet = Object.fromEntries(res.json.costs.unmet.map((n: any) => [n.material, n]));
    // 0.45 m³ of leaves less 2 bags × 0.1136 m³ = 0.2228 m³ still to find.
    expect(unmet.leaves.quantity).toBeCloseTo(0.45 - 2 * 0.1136, 3);
    expect(Object.keys(unmet).sort()).toEqual(["cardboard", "leaves", "straw", "worms"]);
  });

  it("finds and prices a plan itself when asked to match from a point", async () => {
    const res = await post({ bed, start_date: "2027-03-01", match: { origin: FERNHOLLOW, radius_km: 5 } });
    expect(res.status).toBe(200);
    expect(res.json.match).toMatchObject({ origin: FERNHOLLOW, radius_km: 5 });
    expect(res.json.match.stops).toBeGreaterThanOrEqual(4);
    const worms = res.json.costs.by_material.find((m: any) => m.material === "worms");
    // The only worms near: 1.8 kg at €28.00 a kg.
    expect(worms.cost_cents).toBe(5040);
    expect(res.json.costs.unmet).toEqual([]);
  });

  const BAD: [string, unknown, string][] = [
    ["a listing nobody may see", { bed, plan: { items: [{ listing_id: "hidden" }] } }, "plan.items.0.quantity"],
    ["a plan and a match at once", { bed, plan: { items: [{ listing_id: "x", quantity: 1 }] }, match: { origin: FERNHOLLOW } }, "match"],
    ["a match for a rectangle with no origin", { bed, match: {} }, "match.origin"],
    ["a radius past the limit", { bed, match: { origin: FERNHOLLOW, radius_km: 900 } }, "match.radius_km"],
    ["no pickups", { bed, plan: { items: [] } }, "plan.items"],
    ["an unknown field in a pickup", { bed, plan: { items: [{ listing_id: "x", quantity: 1, price_cents: 0 }] } }, "plan.items.0.price_cents"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 for ${label}, with a message on ${field}`, async () => {
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field], JSON.stringify(res.json.error.fields)).toMatch(/\S/);
    });
  }

  it("422 for a pickup of a hidden or unknown listing, on that pickup", async () => {
    const res = await post({ bed, plan: { items: [{ listing_id: ids.board, quantity: 8 }, { listing_id: ids.hidden, quantity: 1 }, { listing_id: "no-such-listing", quantity: 1 }] } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.json.error.fields).sort()).toEqual(["plan.items.1.listing_id", "plan.items.2.listing_id"]);
  });
});
