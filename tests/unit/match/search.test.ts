import { describe, expect, it } from "vitest";
import { matchPlan } from "@/lib/match/plan";
import { cheapestPrice, mergeBoxes, searchPlan, unitPriceFactor } from "@/lib/match/search";
import { BALE_EXPANSION_FACTOR } from "@/lib/calc/facts";
import { inBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";
import type { Need } from "@/lib/match/types";
import { prng } from "@/seeds/ids";
import { FERNHOLLOW, memorySource, randomCounty } from "../../helpers/match";

const NEEDS: Need[] = [
  { material: "cardboard", quantity: 6.4, unit: "m2" },
  { material: "leaves", quantity: 0.45, unit: "m3" },
  { material: "straw", quantity: 0.18, unit: "m3" },
  { material: "worms", quantity: 1.8, unit: "kg" },
];

describe("the ring search against a plan over every listing in the radius", () => {
  it("covers as much, and costs about the same, while reading a fraction of the listings", async () => {
    const r = prng(99);
    const ratios: number[] = [];
    const reads: number[] = [];
    for (let t = 0; t < 40; t++) {
      const all = randomCounty(1000 + t, 400 + Math.floor(r() * 800), 30);
      const origin = { lat: FERNHOLLOW.lat + (r() - 0.5) * 0.15, lng: FERNHOLLOW.lng + (r() - 0.5) * 0.25 };
      const radius = 8 + r() * 12;
      const within = all.map((c) => ({ ...c, distance_km: distanceKm(origin, c.location) })).filter((c) => c.distance_km <= radius);
      const full = matchPlan(NEEDS, within, origin);
      const { plan, stats } = await searchPlan(NEEDS, origin, radius, memorySource(all));
      // Never leaves unmet what the full set covers.
      expect(plan.unmet.length).toBeLessThanOrEqual(full.unmet.length);
      for (const a of plan.allocations) expect(a.distance_km).toBeLessThanOrEqual(radius);
      if (!full.unmet.length) {
        ratios.push(plan.totals.cost_cents / full.totals.cost_cents);
        reads.push(stats.candidates / within.length);
      }
    }
    const mean = ratios.reduce((a, b) => a + b, 0) / ratios.length;
    console.log(`[search] ${ratios.length} counties: cost ${(100 * mean).toFixed(1)} % of the full plan's (worst ${(100 * Math.max(...ratios)).toFixed(1)} %), reading ${(100 * reads.reduce((a, b) => a + b, 0) / reads.length).toFixed(0)} % of the listings in the radius`);
    expect(mean).toBeLessThan(1.05);
  });
});

describe("price per unit size", () => {
  it("turns a floor on the index's price into a floor per need unit", () => {
    // A bale's price per m³ in the bale buys BALE_EXPANSION_FACTOR m³ on the bed.
    expect(unitPriceFactor("straw", "m3")).toBeCloseTo(1 / BALE_EXPANSION_FACTOR, 12);
    expect(unitPriceFactor("worms", "kg")).toBe(1);
    // A bale's stated weight is not tied to its size: nothing can be said per kg.
    expect(unitPriceFactor("straw", "kg")).toBe(0);
  });
  it("prices a need from the cheapest listings, whole bales and all", () => {
    const rows = randomCounty(5, 200, 10).filter((c) => c.material === "straw");
    const cheapest = { rows, last_unit_price: null };
    // 0.5 m³ needs two 0.446 m³ bales: at the cheapest 300 cents a bale, 600.
    expect(cheapestPrice({ material: "straw", quantity: 0.5, unit: "m3" }, cheapest).cents).toBe(600);
  });
});

describe("reading boxes", () => {
  it("joins overlapping neighbourhoods into one box, and keeps far ones apart", () => {
    const near = mergeBoxes([{ centre: FERNHOLLOW, km: 2, cap: Infinity }, { centre: { lat: FERNHOLLOW.lat + 0.005, lng: FERNHOLLOW.lng }, km: 2, cap: Infinity }]);
    expect(near).toHaveLength(1);
    const far = mergeBoxes([{ centre: FERNHOLLOW, km: 1, cap: Infinity }, { centre: { lat: FERNHOLLOW.lat + 0.5, lng: FERNHOLLOW.lng }, km: 1, cap: Infinity }]);
    expect(far).toHaveLength(2);
    expect(inBox(FERNHOLLOW, far[0]) || inBox(FERNHOLLOW, far[1])).toBe(true);
  });
});
