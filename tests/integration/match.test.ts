import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser } from "../factories";
import { FERNHOLLOW } from "../helpers/match";
import * as match from "@/app/api/match/route";
import { seedId } from "@/seeds/ids";
import { distanceKm } from "@/lib/match/geo";
import { estimate } from "@/lib/calc/estimate";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const gardener = seedId("user:gardener");
const bedId = seedId("bed:back-fence");
let stranger: string;
let supplier: string;

beforeAll(async () => {
  ctx = await freshDb({ seed: true });
  stranger = (await createUser({ roles: ["gardener"] })).id;
  supplier = (await createUser({ roles: ["supplier"] })).id;
});
afterAll(() => ctx.close());

const post = async (body: unknown, as?: string) => call(match.POST as never, await request("/api/match", { body, as }));
const NEEDS = [
  { material: "cardboard", quantity: 3.6, unit: "m2" },
  { material: "leaves", quantity: 0.45, unit: "m3" },
  { material: "straw", quantity: 0.18, unit: "m3" },
  { material: "worms", quantity: 0.5, unit: "kg" },
];

describe("POST /api/match with needs (public)", () => {
  it("plans pickups in the documented shape, at the listings' public points", async () => {
    const res = await post({ needs: NEEDS, origin: FERNHOLLOW, radius_km: 15 });
    expect(res.status).toBe(200);
    const plan = res.json;
    expect(plan.unmet).toEqual([]);
    expect(plan.allocations.length).toBeGreaterThanOrEqual(4);
    for (const a of plan.allocations) {
      expect(Object.keys(a)).toEqual(expect.arrayContaining(["listing_id", "material", "quantity", "unit", "listing_quantity", "listing_unit", "distance_km", "cost_cents"]));
      expect(a.distance_km).toBeLessThanOrEqual(15);
    }
    for (const n of NEEDS) {
      const got = plan.allocations.filter((a: any) => a.material === n.material).reduce((s: number, a: any) => s + a.quantity, 0);
      expect(got).toBeGreaterThanOrEqual(n.quantity - 1e-9);
    }
    expect(plan.stops.map((s: any) => s.order)).toEqual(plan.stops.map((_: unknown, i: number) => i + 1));
    const rows = await ctx.db("listings").whereIn("id", plan.stops.map((s: any) => s.listing_id)).select("id", "lat", "lng", "approx_lat", "approx_lng");
    for (const s of plan.stops) {
      const row = rows.find((r: any) => r.id === s.listing_id);
      expect(s.location).toEqual({ lat: row.approx_lat, lng: row.approx_lng });
      expect(s.location).not.toEqual({ lat: row.lat, lng: row.lng });
    }
    const pts = [FERNHOLLOW, ...plan.stops.map((s: any) => s.location), FERNHOLLOW];
    expect(plan.total_distance_km).toBeCloseTo(pts.slice(1).reduce((sum: number, p: any, i: number) => sum + distanceKm(pts[i], p), 0), 2);
    for (const t of plan.trips) {
      expect(t.load_l).toBeLessThanOrEqual(400);
      expect(t.load_kg).toBeLessThanOrEqual(300);
      expect(t.stops.length).toBeGreaterThan(0);
    }
    expect(JSON.stringify(plan)).not.toMatch(/"address"|"lat":52\.\d+,"lng":0\.\d+,"address/);
  });

  it("takes the vehicle and the cost per km it is given", async () => {
    const res = await post({ needs: NEEDS, origin: FERNHOLLOW, vehicle: { load_l: 2000, load_kg: 800 }, cost_per_km_cents: 0 });
    expect(res.status).toBe(200);
    expect(res.json.trips).toHaveLength(1);
    expect(res.json.totals.travel_cents).toBe(0);
  });

  it("reports what nothing nearby can cover", async () => {
    const res = await post({ needs: [{ material: "worms", quantity: 500, unit: "kg" }], origin: FERNHOLLOW, radius_km: 10 });
    expect(res.status).toBe(200);
    expect(res.json.unmet).toHaveLength(1);
    expect(res.json.unmet[0]).toMatchObject({ material: "worms", unit: "kg" });
    expect(res.json.unmet[0].quantity).toBeGreaterThan(400);
  });
});

describe("what the match never offers", () => {
  it("hidden, paused, draft, ended and taken listings, nor more than a reservation allows", async () => {
    const spot = { lat: FERNHOLLOW.lat + 0.3, lng: FERNHOLLOW.lng }; // 33 km north of the demo town
    const bad = [
      (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: spot, status: "hidden" })).id,
      (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: spot, status: "paused" })).id,
      (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: spot, status: "draft" })).id,
      (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: spot, available_until: "2020-01-01T00:00:00.000Z" })).id,
      (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: spot, quantity_total: 4, quantity_held: 3, quantity_collected: 1 })).id,
    ];
    const good = (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: { lat: spot.lat + 0.01, lng: spot.lng }, price_cents: 2500, max_per_reservation: 1.5 })).id;
    const res = await post({ needs: [{ material: "worms", quantity: 3, unit: "kg" }], origin: spot, radius_km: 5 });
    expect(res.status).toBe(200);
    expect(res.json.allocations.map((a: any) => a.listing_id)).toEqual([good]);
    expect(res.json.allocations[0].listing_quantity).toBe(1.5);
    expect(res.json.unmet).toEqual([{ material: "worms", quantity: 1.5, unit: "kg" }]);
    for (const id of bad) expect(JSON.stringify(res.json)).not.toContain(id);
  });
});

describe("POST /api/match with a saved bed", () => {
  it("matches the signed-in gardener's bed from its own size, layers and point", async () => {
    const res = await post({ bed_id: bedId }, gardener);
    expect(res.status).toBe(200);
    const bed = await ctx.db("beds").where({ id: bedId }).first();
    const expected = estimate({ bed: JSON.parse(bed.shape), layers: JSON.parse(bed.recipe) }).needs.map((n) => ({ material: n.material, quantity: n.quantity, unit: n.unit }));
    expect(res.json.needs).toEqual(expected);
    expect(res.json.origin).toEqual({ lat: bed.lat, lng: bed.lng });
    expect(res.json.bed).toEqual({ id: bedId, name: "Back fence bed" });
    // The demo town has enough of everything within the default 15 km.
    expect(res.json.unmet).toEqual([]);
    expect(res.json.stops.length).toBeGreaterThanOrEqual(4);
  });

  const DENIED: [string, unknown, string | undefined, number, string][] = [
    ["anonymous with a bed", { bed_id: bedId }, undefined, 401, "unauthenticated"],
    ["someone else's bed", { bed_id: bedId }, "stranger", 404, "not_found"],
    ["a bed that does not exist", { bed_id: "no-such-bed" }, "gardener", 404, "not_found"],
  ];
  for (const [label, body, who, status, code] of DENIED) {
    it(`${status} for ${label}`, async () => {
      const as = who === "stranger" ? stranger : who === "gardener" ? gardener : undefined;
      const res = await post(body, as);
      expect(res.status).toBe(status);
      expect(res.json.error.code).toBe(code);
      expect(res.json.error.message).toMatch(/\w/);
    });
  }
});

describe("bad input", () => {
  const ok = { needs: NEEDS, origin: FERNHOLLOW };
  const need = (n: Record<string, unknown>) => ({ ...ok, needs: [{ material: "leaves", quantity: 1, unit: "m3", ...n }] });
  const BAD: [string, unknown, string][] = [
    ["an unknown material", need({ material: "gravel" }), "needs.0.material"],
    ["worms by area", need({ material: "worms", unit: "m2" }), "needs.0.unit"],
    ["cardboard by volume", need({ material: "cardboard", unit: "m3" }), "needs.0.unit"],
    ["leaves by area", need({ unit: "m2" }), "needs.0.unit"],
    ["a unit that is not one", need({ unit: "litres" }), "needs.0.unit"],
    ["a quantity of zero", need({ quantity: 0 }), "needs.0.quantity"],
    ["a negative quantity", need({ quantity: -1 }), "needs.0.quantity"],
    ["a quantity in words", need({ quantity: "lots" }), "needs.0.quantity"],
    ["a radius over 200 km", { ...ok, radius_km: 201 }, "radius_km"],
    ["a radius of zero", { ...ok, radius_km: 0 }, "radius_km"],
    ["a radius in words", { ...ok, radius_km: "far" }, "radius_km"],
    ["more than 20 needs", { ...ok, needs: Array.from({ length: 21 }, () => NEEDS[0]) }, "needs"],
    ["no needs at all", { ...ok, needs: [] }, "needs"],
    ["neither needs nor a bed", { origin: FERNHOLLOW }, "needs"],
    ["no origin", { needs: NEEDS }, "origin"],
    ["a latitude past the pole", { ...ok, origin: { lat: 91, lng: 0 } }, "origin.lat"],
    ["a longitude past 180", { ...ok, origin: { lat: 52, lng: -181 } }, "origin.lng"],
    ["an origin in words", { ...ok, origin: "the allotment" }, "origin"],
    ["an origin without lng", { ...ok, origin: { lat: 52 } }, "origin.lng"],
    ["an empty car", { ...ok, vehicle: { load_l: 0, load_kg: 300 } }, "vehicle.load_l"],
    ["a negative cost per km", { ...ok, cost_per_km_cents: -1 }, "cost_per_km_cents"],
    ["a bed id that is a number", { bed_id: 7 }, "bed_id"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 for ${label}, with a message on ${field}`, async () => {
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("says which unit a material takes", async () => {
    const res = await post(need({ material: "worms", unit: "m3" }));
    expect(res.json.error.fields["needs.0.unit"]).toMatch(/kg/);
  });
  it("400 for a body that is not JSON, and for none at all", async () => {
    expect((await call(match.POST as never, await request("/api/match", { rawBody: "needs=leaves" }))).status).toBe(400);
    expect((await call(match.POST as never, await request("/api/match", { method: "POST" }))).status).toBe(400);
  });
  it("422 for JSON that is not an object", async () => {
    expect((await call(match.POST as never, await request("/api/match", { rawBody: "[1,2]" }))).status).toBe(422);
  });
});

describe("a live culture that only comes by post", () => {
  it("is a parcel line, not a stop: no driving to it, no carload, still covered", async () => {
    const spot = { lat: FERNHOLLOW.lat - 0.3, lng: FERNHOLLOW.lng }; // 33 km south of the demo town
    const far = { lat: spot.lat + 0.05, lng: spot.lng + 0.05 }; // about 6.5 km away
    const posted = (await createListing({ owner_id: supplier, material_code: "worms", unit: "kg", location: far, price_cents: 3000, quality: { species: "Eisenia fetida", pickup: false } })).id;
    const res = await post({ needs: [{ material: "worms", quantity: 0.5, unit: "kg" }], origin: spot, radius_km: 15 });
    expect(res.status).toBe(200);
    expect(res.json.unmet).toEqual([]);
    expect(res.json.allocations).toEqual([expect.objectContaining({ listing_id: posted, fulfilment: "post", pickup_choices: [] })]);
    expect(res.json.stops).toEqual([]);
    expect(res.json.trips).toEqual([]);
    expect(res.json.total_distance_km).toBe(0);
    expect(res.json.totals).toMatchObject({ stops: 0, parcels: 1, travel_cents: 0 });
  });

  it("offers each stop its pickup times, the first one leaving time to answer", async () => {
    const res = await post({ needs: NEEDS, origin: FERNHOLLOW, radius_km: 15 });
    const stop = res.json.allocations.find((a: any) => a.fulfilment === "pickup" && a.pickup_choices.length);
    expect(stop?.pickup_choices.length).toBeGreaterThan(0);
    // A listing that accepts at once may offer a window that is open right now (go while it is
    // open); one that must answer first offers only openings that start after the answer is due.
    for (const c of stop.pickup_choices) {
      if (stop.auto_accept) expect(new Date(c.next_end).getTime()).toBeGreaterThan(Date.now());
      else expect(new Date(c.next_start).getTime()).toBeGreaterThan(Date.now());
    }
    if (!stop.auto_accept) expect(new Date(stop.pickup_choices[0].answer_by).getTime()).toBeLessThanOrEqual(new Date(stop.pickup_choices[0].next_start).getTime());
  });
});
