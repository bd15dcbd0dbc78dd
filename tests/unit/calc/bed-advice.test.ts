import { describe, expect, it } from "vitest";
import { blend, blendAdvice } from "@/lib/calc/blend";
import { bedAdvice } from "@/lib/calc/bed-advice";
import { estimate } from "@/lib/calc/estimate";

// Conversions: NIST HB44 (exact). Densities: Missouri S&T (lb/US gal); composition: NRAES-54
// Table A.1; the mixture formula: Cornell, "Getting the Right Mix". Layer limits: common
// practice, no source (clippings past about 3 cm mat).
const LB_GAL = 0.45359237 / 0.003785411784;

describe("C:N advice a 10 m² sheet-mulch bed can follow", () => {
  // 5 × 2 m with every default layer. By hand: 18 sheets × 0.8 m² × 0.5 kg/m² = 7.2 kg of
  // board @ 8 %, 0.563 × 0.1 %N; 1.25 m³ leaves × 119.83 = 149.78 kg @ 38 %; 0.5 m³ straw ×
  // 45.77 = 22.88 kg @ 12 %: C:N 61.2 (Cornell's formula).
  const r = estimate({ bed: { length_m: 5, width_m: 2 }, start_date: "2027-03-01" });
  const a = r.blend.bed_advice!;

  it("starts from the bed's own C:N", () => {
    expect(r.blend.cn_ratio).toBeCloseTo(61.2, 1);
    expect(a.verdict).toBe("carbon_rich");
  });

  it("offers grass clippings only as a layer of about 3 cm at most, in depth, volume, bags and mass", () => {
    // A 3 cm layer over 10 m² = 0.3 m³ × 1.7 lb/US gal (loose clippings) = 61.1 kg, in
    // 30 US gal bags (0.1136 m³): 3 bags. The old advice asked for 143 kg, a 7 cm mat.
    expect(a.first).toMatchObject({ material: "grass_clippings", depth_cm: 3, m3: 0.3, bags: 3, capped: true, reaches_range: false });
    expect(a.first!.kg).toBeCloseTo(0.3 * 1.7 * LB_GAL, 1);
    // With it: C:N 49.0 (Cornell's formula, by hand) — still above 40.
    expect(a.first!.cn_after).toBeCloseTo(49.0, 1);
  });

  it("says the clippings cannot reach the range, names the next steps, and that waiting is fine", () => {
    // On top of the clippings: 3 cm of horse manure (0.3 m³ × 6.8 lb/US gal = 244.4 kg) gives
    // 40.5; 1 cm of coffee grounds (0.1 m³ × 7 lb/US gal = 83.9 kg) gives 42.0. Neither quite
    // reaches 40, so the advice ends on patience.
    expect(a.then.map((t) => t.material)).toEqual(["manure", "coffee_grounds"]);
    expect(a.then[0].kg).toBeCloseTo(0.3 * 6.8 * LB_GAL, 1);
    expect(a.then[0].cn_after).toBeCloseTo(40.5, 1);
    expect(a.then[1].kg).toBeCloseTo(0.1 * 7 * LB_GAL, 1);
    expect(a.then[1].cn_after).toBeCloseTo(42.0, 1);
    expect(a.patience).toBe(true);
    expect(r.blend.advice).toMatch(/no deeper than about 3 cm/);
    expect(r.blend.advice).toMatch(/mats/);
    expect(r.blend.advice).toMatch(/slow bed is fine/);
  });

  it("writes the advice in the units the request asks for", () => {
    const imperial = estimate({ bed: { length_m: 5, width_m: 2 }, start_date: "2027-03-01", units: "imperial" }).blend.advice!;
    // 3 cm = 1.18 in; 0.3 m³ = 10.6 ft³; 61.1 kg = 135 lb (NIST HB44).
    expect(imperial).toMatch(/1\.2 in/);
    expect(imperial).toMatch(/10\.6 ft³/);
    expect(imperial).toMatch(/135 lb/);
    expect(imperial).not.toMatch(/\bcm\b|\bkg\b|m³/);
  });

  it("never suggests a clippings layer deeper than 3 cm, whatever the bed (common practice)", () => {
    for (const [l, w, leaves] of [[1, 1, 5], [20, 10, 30], [3, 1.2, 12.5], [8, 4, 20]] as const) {
      const adv = estimate({ bed: { length_m: l, width_m: w }, layers: { leaves: { depth_cm: leaves } }, start_date: "2027-03-01" }).blend.bed_advice!;
      if (adv.first?.material === "grass_clippings") expect(adv.first.depth_cm).toBeLessThanOrEqual(3);
    }
  });

  it("when a thin layer is enough, asks only for that, rounded up so the bed lands in range", () => {
    // 10 kg leaves + 5 kg clippings: C:N 40.9 (by the same formula); over 1 m² half a
    // centimetre of clippings (0.005 m³ × 1.7 lb/US gal = 1.02 kg) brings it to 39.3.
    const mix = blend([{ material: "leaves", mass_kg: 10 }, { material: "grass_clippings", mass_kg: 5 }]);
    const small = bedAdvice(mix, 1);
    expect(small.first).toMatchObject({ material: "grass_clippings", depth_cm: 0.5, reaches_range: true, capped: false });
    expect(small.first!.cn_after).toBeCloseTo(39.3, 1);
    expect(small.then).toEqual([]);
    expect(small.text).not.toMatch(/slow bed/);
  });

  it("says nothing inside 25–40 (The Composting Handbook, 2022, Table 4.2)", () => {
    // 10 kg leaves + 8 kg clippings: C:N 36.7.
    const mix = blend([{ material: "leaves", mass_kg: 10 }, { material: "grass_clippings", mass_kg: 8 }]);
    expect(bedAdvice(mix, 2)).toMatchObject({ verdict: "in_range", text: null, first: null });
  });

  it("leaves the mix calculator's advice whole: the mass that reaches 40, however much", () => {
    // The same bed as a pile: the calculator still names the full mass of clippings.
    const pile = blend([{ material: "cardboard", mass_kg: 7.2 }, { material: "leaves", mass_kg: 149.78 }, { material: "straw", mass_kg: 22.88 }]);
    expect(blendAdvice(pile)).toMatch(/\d+ kg of grass clippings/);
  });
});
