import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { blend, blendAdvice, massToReachCn, type BlendComponent } from "@/lib/calc/blend";

// Worked by hand with the Cornell mixture formula (Cornell Waste Management Institute,
// "Getting the Right Mix"), R = Σ Q·C·(100 − M) / Σ Q·N·(100 − M), using NRAES-54 Table A.1:
//   leaves  Q = 10 kg, N = 0.9 %, C:N 54 → C = 48.6 %, M = 38 %
//   grass   Q =  2 kg, N = 3.4 %, C:N 17 → C = 57.8 %, M = 82 %
//   numerator   10 × 48.6 × 62 + 2 × 57.8 × 18 = 30,132 + 2,080.8 = 32,212.8
//   denominator 10 × 0.9 × 62 + 2 × 3.4 × 18  =    558 +   122.4 =    680.4
//   R = 32,212.8 / 680.4 = 47.344
//   G = (10 × 38 + 2 × 82) / 12 = 544 / 12 = 45.333 %
//   dry = 6.2 + 0.36 = 6.56 kg; C = 3.01320 + 0.20808 = 3.22128 kg; N = 0.0558 + 0.01224 = 0.06804 kg
//   water to 55 %: 6.56 / 0.45 − 12 = 2.5778 L
const example: BlendComponent[] = [
  { material: "leaves", mass_kg: 10 },
  { material: "grass_clippings", mass_kg: 2 },
];

describe("blend", () => {
  it("matches the hand-worked Cornell example", () => {
    const r = blend(example, 55);
    expect(r.cn_ratio).toBeCloseTo(47.344, 3);
    expect(r.moisture_pct).toBeCloseTo(45.333, 3);
    expect(r.dry_mass_kg).toBeCloseTo(6.56, 10);
    expect(r.carbon_kg).toBeCloseTo(3.22128, 8);
    expect(r.nitrogen_kg).toBeCloseTo(0.06804, 8);
    expect(r.water_to_target_l).toBeCloseTo(2.5778, 4);
  });

  it("leaves water_to_target_l out without a target", () => {
    expect(blend(example)).not.toHaveProperty("water_to_target_l");
  });

  it("a single material keeps its own C:N and moisture (NRAES-54 Table A.1: straw 80, 12 %)", () => {
    const r = blend([{ material: "straw", mass_kg: 7 }]);
    expect(r.cn_ratio).toBeCloseTo(80, 10);
    expect(r.moisture_pct).toBeCloseTo(12, 10);
  });

  it("lets explicit values override the table, and c_pct override %N × C:N", () => {
    // 1 kg at 50 % moisture, N 1 %, C 30 % → C:N 30 regardless of the leaves' own figures.
    const r = blend([{ material: "leaves", mass_kg: 1, moisture_pct: 50, n_pct: 1, cn_ratio: 99, c_pct: 30 }]);
    expect(r.cn_ratio).toBeCloseTo(30, 10);
    expect(r.moisture_pct).toBeCloseTo(50, 10);
    expect(r.dry_mass_kg).toBeCloseTo(0.5, 10);
  });

  it("takes a material-less component given in full", () => {
    const r = blend([{ mass_kg: 4, moisture_pct: 25, n_pct: 2, cn_ratio: 15 }]);
    expect(r.cn_ratio).toBeCloseTo(15, 10);
    expect(r.nitrogen_kg).toBeCloseTo(4 * 0.75 * 0.02, 12);
  });

  it("refuses a component it cannot place (compost has no %N on file)", () => {
    expect(() => blend([{ material: "compost", mass_kg: 1 }])).toThrow(/component 0/);
    expect(() => blend([{ mass_kg: 1, moisture_pct: 20 }])).toThrow(RangeError);
  });

  it("keeps the blend's C:N between its components' extremes (fast-check)", () => {
    const component = fc.record({
      mass_kg: fc.double({ min: 0.01, max: 1000, noNaN: true }),
      moisture_pct: fc.double({ min: 0, max: 95, noNaN: true }),
      n_pct: fc.double({ min: 0.05, max: 10, noNaN: true }),
      cn_ratio: fc.double({ min: 5, max: 800, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(component, { minLength: 1, maxLength: 8 }), (parts) => {
        const r = blend(parts).cn_ratio;
        const ratios = parts.map((p) => p.cn_ratio);
        expect(r).toBeGreaterThanOrEqual(Math.min(...ratios) * (1 - 1e-9));
        expect(r).toBeLessThanOrEqual(Math.max(...ratios) * (1 + 1e-9));
      }),
    );
  });
});

describe("massToReachCn", () => {
  it("solves the hand example for grass clippings to reach 40", () => {
    // q = (C − 40·N) / (d·(40·n − c)) with grass d = 0.18, n = 0.034, c = 0.578:
    //   (3.22128 − 2.7216) / (0.18 × 0.782) = 0.49968 / 0.14076 = 3.5499 kg
    const q = massToReachCn(blend(example), "grass_clippings", 40)!;
    expect(q).toBeCloseTo(3.5499, 3);
    expect(blend([...example, { material: "grass_clippings", mass_kg: q }]).cn_ratio).toBeCloseTo(40, 9);
  });

  it("returns null when the material pushes the ratio the wrong way", () => {
    expect(massToReachCn(blend(example), "straw", 40)).toBeNull();
  });
});

describe("blendAdvice", () => {
  it("names nitrogen sources above 40, rounded up (hand example: 3.55 → 3.6 kg clippings, 4.83 → 4.9 kg coffee)", () => {
    // coffee: d = 0.225, n = 0.023, c = 0.46 → 0.49968 / (0.225 × 0.46) = 4.828 kg
    const advice = blendAdvice(blend(example))!;
    expect(advice).toMatch(/grass clippings/);
    expect(advice).toMatch(/3\.6 kg/);
    expect(advice).toMatch(/coffee grounds/);
    expect(advice).toMatch(/4\.9 kg/);
    expect(advice).toMatch(/40/);
  });

  it("names carbon sources below 25", () => {
    // 10 kg grass clippings: dry 1.8 kg, C 1.0404 kg, N 0.0612 kg, C:N 17.
    // Leaves (d = 0.62, n = 0.009, c = 0.486) to 25:
    //   (1.0404 − 1.53) / (0.62 × (0.225 − 0.486)) = −0.4896 / −0.16182 = 3.0256 kg → rounded up, 3.1 kg
    const advice = blendAdvice([{ material: "grass_clippings", mass_kg: 10 }])!;
    expect(advice).toMatch(/leaves/);
    expect(advice).toMatch(/straw/);
    expect(advice).toMatch(/cardboard/);
    expect(advice).toMatch(/3\.1 kg of fallen leaves/);
    expect(advice).toMatch(/25/);
  });

  it("is null inside 25–40 (The Composting Handbook, 2022, Table 4.2)", () => {
    // Horse manure alone: C:N 30 (NRAES-54 Table A.1).
    expect(blendAdvice([{ material: "manure", mass_kg: 50 }])).toBeNull();
  });
});
