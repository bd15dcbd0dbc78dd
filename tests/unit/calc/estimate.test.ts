import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { estimate } from "@/lib/calc/estimate";
import { estimateSchema, type EstimateInput } from "@/lib/validation/estimate";

const LB_GAL = 0.45359237 / 0.003785411784; // kg/m³ per lb/US gal (NIST HB44) = 119.826
const LB_FT3 = 0.45359237 / 0.3048 ** 3; // kg/m³ per lb/ft³ (NIST HB44) = 16.018

describe("estimate — a 4 × 1.2 m bed with every default", () => {
  const r = estimate({ bed: { length_m: 4, width_m: 1.2 }, start_date: "2026-03-01" });
  const need = (m: string) => r.needs.find((n) => n.material === m) as unknown as Record<string, unknown>;

  it("lists the four default layers in order, with the contract's fields", () => {
    expect(r.area_m2).toBeCloseTo(4.8, 10);
    expect(r.needs.map((n) => [n.material, n.unit])).toEqual([
      ["cardboard", "m2"],
      ["leaves", "m3"],
      ["straw", "m3"],
      ["worms", "kg"],
    ]);
    expect(Object.keys(r)).toEqual(expect.arrayContaining(["area_m2", "needs", "water_l", "blend", "timeline", "cautions"]));
    expect(r).not.toHaveProperty("centroid");
  });

  it("cardboard: 10 sheets of 1.0 × 0.8 m, 8 m², 4 kg", () => {
    // ceil((4 − 0.15)/0.85) = 5 along × ceil((1.2 − 0.15)/0.65) = 2 across; 10 × 0.8 m² × 0.5 kg/m²
    expect(need("cardboard")).toMatchObject({ quantity: 8, sheets: 10, mass_kg: 4 });
  });

  it("leaves: 12.5 cm over 4.8 m² = 0.6 m³, 71.9 kg at 1 lb/gal (Missouri S&T), 6 bags of 30 gal", () => {
    // 0.6 / 0.113562 = 5.28 → 6
    expect(need("leaves")).toMatchObject({ quantity: 0.6, bags: 6 });
    expect(need("leaves").mass_kg).toBeCloseTo(0.6 * LB_GAL, 2);
  });

  it("straw: 5 cm = 0.24 m³ spread, one bale (covers 0.446 m³ loosened)", () => {
    // mass: a 45 lb bale of 5.25 ft³ spread over three times its volume (common practice)
    // is 45 / 15.75 = 2.857 lb/ft³ = 45.77 kg/m³ (NIST HB44); × 0.24 m³ = 10.98 kg.
    expect(need("straw")).toMatchObject({ quantity: 0.24, bales: 1 });
    expect(need("straw").mass_kg).toBeCloseTo(0.24 * (45 / 15.75) * LB_FT3, 2);
  });

  it("worms: 0.5 kg/m² → 2.4 kg, about 5,291 worms at 1,000 per lb (common practice)", () => {
    // 2.4 kg / 0.45359237 = 5.291 lb × 1,000
    expect(need("worms")).toMatchObject({ quantity: 2.4, count: 5291 });
  });

  it("water and blend follow the mass balance and the Cornell formula", () => {
    // By hand (NRAES-54 Table A.1 composition):
    //   cardboard 4 kg @ 8 %  → dry 3.680, C 3.680 × 0.563 = 2.0718, N 0.00368
    //   leaves 71.896 @ 38 % → dry 44.575, C × 0.486 = 21.6636,   N 0.40118
    //   straw 10.984 @ 12 %  → dry 9.666,  C × 0.560 = 5.4130,    N 0.06766
    //   C:N = 29.148 / 0.47252 = 61.69; moisture = (86.880 − 57.921) / 86.880 = 33.3 %
    //   water to 55 %: 57.921 / 0.45 − 86.880 = 41.8 L
    expect(r.blend.cn_ratio).toBeCloseTo(61.7, 0);
    expect(r.blend.moisture_pct).toBeCloseTo(33.3, 1);
    expect(r.water.to_target_l).toBeCloseTo(41.8, 1);
  });

  it("gives the first soak as a range over the published spreads, with a quarter more for drainage", () => {
    // Least: cardboard at 0.4 kg/m² (from memory) = 3.2 kg @ 8 %; leaves loose at 1 lb/US gal
    //   (Missouri S&T) = 71.896 kg @ 38 %; straw at 1 lb/ft³ (loose, common practice) = 3.844 kg
    //   at 27 % (NRAES-54 Table A.1's wettest straw): 32.9 L to 55 %.
    // Most: cardboard 0.6 kg/m² = 4.8 kg; leaves compacted 2 lb/US gal (Missouri S&T) = 143.79 kg;
    //   straw 3 lb/ft³ = 11.533 kg at 4 % (the driest): 72.4 L.
    // Pour a quarter again for what drains into the soil (common practice): 41.1–90.5 L,
    // middle 65.8 L; over 4.8 m² that is a 14 mm soak; 65.8 L = 17.4 US gal (NIST HB44).
    expect(r.water.to_target_range_l[0]).toBeCloseTo(32.9, 1);
    expect(r.water.to_target_range_l[1]).toBeCloseTo(72.4, 1);
    expect(r.water.drainage_share).toBe(0.25);
    // Rounded as water is poured: to 5 L between 10 and 100 L, to the gallon under 30 gal.
    expect(r.water_range_l).toEqual([40, 90]);
    expect(r.water_l).toBe(65);
    expect(r.water_us_gal).toBe(17);
    expect(r.water_depth_mm).toBe(14);
    expect(r.water_range_l[0]).toBeLessThanOrEqual(r.water_l);
    expect(r.water_l).toBeLessThanOrEqual(r.water_range_l[1]);
    expect(r.water.guide).toMatch(/squeezed handful/);
  });

  it("names what would bring the mix into range", () => {
    expect(r.blend.advice).toMatch(/grass clippings/);
  });

  it("dates planting into it (6–9 months, Oregon State Extension) apart from soil (a year), and says how far it sinks", () => {
    expect(r.planting).toEqual({ build: "2026-03-01", plant_into_from: "2026-09-01", plant_into_until: "2026-12-01", soil_by: "2027-03-01" });
    // 12.5 cm of leaves + 5 cm of straw = 17.5 cm, sinking to 60 %, 50 % and 40 % (common practice).
    expect(r.settling).toEqual({ built_depth_cm: 17.5, after: [{ months: 3, depth_cm: 10.5 }, { months: 6, depth_cm: 8.8 }, { months: 12, depth_cm: 7 }] });
  });

  it("lists each top-up with its volume and bags for this 4.8 m² bed", () => {
    // Leaves 5 cm: 0.24 m³ / 0.1136 = 2.1 → 3 bags; clippings 2 cm: 0.096 m³ → 1 bag (common practice depths).
    expect(r.top_ups[0]).toEqual({ date: "2026-06-15", material: "grass_clippings", depth_cm: 2, m3: 0.096, bags: 1 });
    expect(r.top_ups.find((t) => t.material === "leaves")).toMatchObject({ depth_cm: 5, m3: 0.24, bags: 3 });
  });

  it("carries the timeline and the cautions for every default layer", () => {
    expect(r.timeline[0]).toMatchObject({ key: "build", date: "2026-03-01" });
    expect(r.timeline.some((e) => e.key === "add_worms")).toBe(true);
    const all = r.cautions.join(" ");
    for (const word of [/tape/, /roadside/, /beans or peas/, /NIOSH/, /species/, /gloves/, /watering restrictions/]) {
      expect(all).toMatch(word);
    }
    expect(r.cautions.at(-1)).toMatch(/local rules/);
  });
});

describe("estimate — choices", () => {
  const bed = { length_m: 3, width_m: 2 };

  it("leaves out layers set to false, and their cautions", () => {
    const r = estimate({ bed, layers: { straw: false, worms: false }, start_date: "2026-05-01" });
    expect(r.needs.map((n) => n.material)).toEqual(["cardboard", "leaves"]);
    expect(r.cautions.join(" ")).not.toMatch(/NIOSH|species/);
    expect(r.timeline.some((e) => e.key === "add_worms")).toBe(false);
  });

  it("adds wood chips when asked, and uses the given depths and settings", () => {
    const r = estimate({
      bed,
      layers: { leaves: { depth_cm: 20 }, wood_chips: true, cardboard: { overlap_cm: 30 }, worms: { kg_per_m2: 1 } },
      start_date: "2026-05-01",
    });
    const chips = r.needs.find((n) => n.material === "wood_chips")!;
    expect(chips.quantity).toBeCloseTo(6 * 0.075, 6); // 7.5 cm default (from memory)
    expect(r.needs.find((n) => n.material === "leaves")!.quantity).toBeCloseTo(1.2, 6);
    expect(r.needs.find((n) => n.material === "worms")!.quantity).toBeCloseTo(6, 6);
    // 30 cm seams: along 3 m ceil(2.7/0.7) = 4 × across 2 m ceil(1.7/0.5) = 4 = 16; turned: ceil(2.7/0.5) = 6 × ceil(1.7/0.7) = 3 = 18
    expect(r.needs.find((n) => n.material === "cardboard")).toMatchObject({ sheets: 16 });
  });

  it("a wetter target asks for more water", () => {
    const dry = estimate({ bed, target_moisture_pct: 45, start_date: "2026-05-01" }).water_l;
    const wet = estimate({ bed, target_moisture_pct: 65, start_date: "2026-05-01" }).water_l;
    expect(wet).toBeGreaterThan(dry);
  });

  it("with only worms there is nothing to blend or water", () => {
    const r = estimate({ bed, layers: { cardboard: false, leaves: false, straw: false }, start_date: "2026-05-01" });
    expect(r.blend).toEqual({ cn_ratio: null, moisture_pct: null, advice: null, bed_advice: null });
    expect(r.water_l).toBe(0);
  });

  it("starts today (UTC) when no start date is given", () => {
    const r = estimate({ bed }, new Date("2030-07-04T23:30:00Z"));
    expect(r.timeline[0].date).toBe("2030-07-04");
  });

  it("gives the same answer for parsed and unparsed input", () => {
    const raw = { bed, start_date: "2026-05-01" };
    expect(estimate(estimateSchema.parse(raw))).toEqual(estimate(raw));
  });

  it("scales every volume and mass linearly with area (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 20, noNaN: true }), fc.integer({ min: 2, max: 5 }), (len, k) => {
        const at = (l: number) => estimate({ bed: { length_m: l, width_m: 2 }, start_date: "2026-05-01" });
        const one = at(len);
        const many = at(len * k);
        for (const m of ["leaves", "straw"]) {
          const a = one.needs.find((n) => n.material === m)! as { quantity: number; mass_kg: number };
          const b = many.needs.find((n) => n.material === m)! as { quantity: number; mass_kg: number };
          // Outputs are rounded (3 places for m³, 2 for kg), so compare within that rounding.
          expect(Math.abs(b.quantity - k * a.quantity)).toBeLessThanOrEqual(0.0005 * (k + 1));
          expect(Math.abs(b.mass_kg - k * a.mass_kg)).toBeLessThanOrEqual(0.005 * (k + 1));
        }
      }),
      { numRuns: 40 },
    );
  });
});

describe("estimate — an outline", () => {
  // About 10 × 10 m near Hobart (southern hemisphere).
  const polygon = {
    type: "Polygon" as const,
    coordinates: [[[147.3, -42.88], [147.30012, -42.88], [147.30012, -42.87991], [147.3, -42.87991], [147.3, -42.88]]],
  };
  const input: EstimateInput = { bed: { polygon }, start_date: "2026-03-01" };

  it("reports the centroid and takes the hemisphere from it", () => {
    const r = estimate(input);
    expect(r.centroid!.lat).toBeCloseTo(-42.879955, 5);
    expect(r.centroid!.lng).toBeCloseTo(147.30006, 5);
    expect(r.timeline.find((e) => e.key === "top_up")!.date).toBe("2026-04-15"); // southern autumn leaves
  });

  it("lets an explicit latitude win over the centroid", () => {
    const r = estimate({ ...input, latitude: 45 });
    expect(r.timeline.find((e) => e.key === "top_up")!.date).toBe("2026-06-15");
  });

  it("covers the outline's area with cardboard", () => {
    const r = estimate(input);
    expect(r.area_m2).toBeGreaterThan(90);
    expect(r.needs[0].quantity).toBeGreaterThanOrEqual(r.area_m2);
  });
});
