import { describe, expect, it } from "vitest";
import { NIOSH_LIFT_LIMIT_KG, MATERIALS } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import { matchPlan, mergeNeeds } from "@/lib/match/plan";
import { splitTrips } from "@/lib/match/trips";
import type { CandidateListing } from "@/lib/match/types";
import { candidateListing } from "../../factories/listings";
import { FERNHOLLOW } from "../../helpers/match";

const at = (dLat: number, dLng: number) => ({ lat: FERNHOLLOW.lat + dLat, lng: FERNHOLLOW.lng + dLng });

const LISTINGS: CandidateListing[] = [
  candidateListing(FERNHOLLOW, { id: "board", material: "cardboard", unit: "sheets", unit_size: 0.8, unit_mass_kg: null, available: 25, max_per_reservation: 20, price_cents: 0, location: at(0.01, 0.01) }),
  candidateListing(FERNHOLLOW, { id: "leafbags", material: "leaves", unit: "bags", unit_size: 0.1136, unit_mass_kg: null, available: 12, max_per_reservation: null, price_cents: 0, location: at(-0.01, 0.02) }),
  candidateListing(FERNHOLLOW, { id: "bales", material: "straw", unit: "bales", unit_size: 0.1487, unit_mass_kg: 20, available: 30, max_per_reservation: 12, price_cents: 450, location: at(0.02, -0.02) }),
  candidateListing(FERNHOLLOW, { id: "worms", material: "worms", unit: "kg", unit_size: null, unit_mass_kg: null, available: 6, max_per_reservation: 2, price_cents: 3200, location: at(0.015, 0.03) }),
  candidateListing(FERNHOLLOW, { id: "manure", material: "manure", unit: "bags", unit_size: 0.04, unit_mass_kg: null, available: 30, max_per_reservation: 10, price_cents: 150, location: at(-0.02, -0.01) }),
];

describe("a pickup plan", () => {
  const plan = matchPlan(
    [
      { material: "cardboard", quantity: 6.4, unit: "m2" },
      { material: "leaves", quantity: 0.45, unit: "m3" },
      { material: "straw", quantity: 0.18, unit: "m3" },
      { material: "worms", quantity: 1.8, unit: "kg" },
    ],
    LISTINGS,
    FERNHOLLOW,
  );

  it("covers every need, in whole sheets, bags and bales", () => {
    expect(plan.unmet).toEqual([]);
    const by = Object.fromEntries(plan.allocations.map((a) => [a.listing_id, a]));
    expect(by.board.listing_quantity).toBe(8); // 8 × 0.8 m² = 6.4 m²
    expect(by.leafbags.listing_quantity).toBe(4); // 4 × 0.1136 = 0.454 m³ ≥ 0.45
    expect(by.bales.listing_quantity).toBe(1); // one bale spreads to 0.446 m³ ≥ 0.18
    expect(by.worms.listing_quantity).toBeCloseTo(1.8, 9);
    expect(by.bales.cost_cents).toBe(450);
    expect(by.worms.cost_cents).toBe(5760);
  });
  it("numbers the stops in visiting order, and the loop returns to the origin", () => {
    expect(plan.stops.map((s) => s.order)).toEqual(plan.stops.map((_, i) => i + 1));
    expect(plan.stops.map((s) => s.listing_id)).toEqual(plan.allocations.map((a) => a.listing_id));
    const pts = [FERNHOLLOW, ...plan.stops.map((s) => s.location), FERNHOLLOW];
    const loop = pts.slice(1).reduce((sum, p, i) => sum + distanceKm(pts[i], p), 0);
    expect(plan.total_distance_km).toBeCloseTo(loop, 3);
  });
  it("splits into carloads by the vehicle, and adds up its totals", () => {
    // Four leaf bags are 454 L, more than a small car's 400 L boot: two trips.
    expect(plan.trips.length).toBe(2);
    expect(plan.driving_distance_km).toBeGreaterThan(plan.total_distance_km);
    const van = matchPlan(plan.needs, LISTINGS, FERNHOLLOW, { vehicle: { load_l: 1500, load_kg: 600 } });
    expect(van.trips).toHaveLength(1);
    expect(van.trips[0].stops.sort()).toEqual(van.stops.map((s) => s.listing_id).sort());
    expect(van.driving_distance_km).toBeCloseTo(van.total_distance_km, 2);
    expect(plan.totals.price_cents).toBe(450 + 5760);
    expect(plan.totals.cost_cents).toBe(plan.totals.price_cents + plan.totals.travel_cents + plan.totals.stop_cents);
  });
  it("names no lifting caution for a 20 kg bale (under NIOSH's 23 kg)", () => {
    expect(plan.cautions.some((c) => c.kind === "lifting")).toBe(false);
    expect(plan.cautions.some((c) => /weedkiller/.test(c.message))).toBe(true);
  });

  it("names the lifting caution when one bag weighs over 23 kg (NIOSH: 51 lb)", () => {
    // 0.04 m³ of horse manure at 6.8 lb/US gal (Missouri S&T) = 32.6 kg a bag.
    const heavy = matchPlan([{ material: "manure", quantity: 0.1, unit: "m3" }], LISTINGS, FERNHOLLOW);
    const caution = heavy.cautions.find((c) => c.kind === "lifting");
    expect(heavy.allocations[0].item_kg).toBeCloseTo(0.04 * MATERIALS.manure.bulk_density_kg_m3, 1);
    expect(heavy.allocations[0].item_kg!).toBeGreaterThan(NIOSH_LIFT_LIMIT_KG);
    expect(caution?.message).toMatch(/23 kg \(51 lb\)/);
    expect(caution?.listing_ids).toEqual(["manure"]);
  });

  it("reports what the listings cannot cover, and suggests nothing it cannot back", () => {
    const short = matchPlan([{ material: "worms", quantity: 5, unit: "kg" }], LISTINGS, FERNHOLLOW);
    // Only one worm listing, at most 2 kg a reservation.
    expect(short.allocations.map((a) => a.listing_quantity)).toEqual([2]);
    expect(short.unmet).toEqual([{ material: "worms", quantity: 3, unit: "kg" }]);
    const none = matchPlan([{ material: "compost", quantity: 1, unit: "m3" }], LISTINGS, FERNHOLLOW);
    expect(none.allocations).toEqual([]);
    expect(none.unmet).toEqual([{ material: "compost", quantity: 1, unit: "m3" }]);
    expect(none.total_distance_km).toBe(0);
    expect(none.trips).toEqual([]);
  });

  it("adds up needs for the same material given in two units", () => {
    const merged = mergeNeeds([
      { material: "leaves", quantity: 0.2, unit: "m3" },
      { material: "leaves", quantity: 0.2 * MATERIALS.leaves.bulk_density_kg_m3, unit: "kg" },
    ]);
    expect(merged).toHaveLength(1);
    expect(merged[0].quantity).toBeCloseTo(0.4, 9);
  });

  it("lets the caller change what driving and stops cost", () => {
    const far = candidateListing(FERNHOLLOW, { id: "far-free", material: "straw", unit: "bales", unit_size: 0.1487, unit_mass_kg: 20, available: 5, max_per_reservation: null, price_cents: 0, location: at(0.15, 0) });
    const needs = [{ material: "straw" as const, quantity: 0.18, unit: "m3" as const }];
    // 16.7 km out and back costs 10 € at 30 c/km, more than the 4.50 € bale 2.7 km away…
    expect(matchPlan(needs, [...LISTINGS, far], FERNHOLLOW).allocations[0].listing_id).toBe("bales");
    // …but driving for free, the free bale wins.
    expect(matchPlan(needs, [...LISTINGS, far], FERNHOLLOW, { costs: { cost_per_km_cents: 0 } }).allocations[0].listing_id).toBe("far-free");
  });
});

describe("carloads", () => {
  const stop = (id: string, units: number, unit_l: number, unit_kg: number, whole = true) => ({ listing_id: id, location: at(0.01 * units, 0.01), units, whole, unit_l, unit_kg });
  it("splits by volume and by mass, and never overloads", () => {
    const plan = splitTrips(FERNHOLLOW, [stop("a", 3, 150, 20), stop("b", 2, 100, 90), stop("c", 1, 50, 10)], { load_l: 400, load_kg: 150 });
    for (const t of plan.trips) {
      expect(t.load_l).toBeLessThanOrEqual(400);
      expect(t.load_kg).toBeLessThanOrEqual(150);
    }
    const carried = plan.trips.reduce((s, t) => s + t.load_l, 0);
    expect(carried).toBeCloseTo(3 * 150 + 2 * 100 + 50, 6);
    expect(plan.oversize).toEqual([]);
  });
  it("gives a stop bigger than the car trips of its own, whole bales each time", () => {
    const plan = splitTrips(FERNHOLLOW, [stop("bales", 7, 149, 20)], { load_l: 400, load_kg: 300 });
    // Two bales a load (298 L): 7 bales take four trips.
    expect(plan.trips.map((t) => t.load_l)).toEqual([298, 298, 298, 149]);
  });
  it("flags an item too big for the car on its own", () => {
    const plan = splitTrips(FERNHOLLOW, [stop("big", 1, 900, 20)], { load_l: 400, load_kg: 300 });
    expect(plan.oversize).toEqual(["big"]);
    expect(plan.trips).toHaveLength(1);
  });
});
