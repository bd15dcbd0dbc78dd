import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { BAG_M3, BALE_EXPANSION_FACTOR, BALE_M3, LAYER_DEPTH_CM, MATERIALS } from "@/lib/calc/facts";
import { bagsFor, balesFor, layerVolume } from "@/lib/calc/layers";

const IN_CM = 2.54; // NIST HB44

describe("layer defaults (common practice)", () => {
  it("leaves go down 4–6 in deep", () => {
    expect(LAYER_DEPTH_CM.leaves.default).toBeGreaterThanOrEqual(4 * IN_CM);
    expect(LAYER_DEPTH_CM.leaves.default).toBeLessThanOrEqual(6 * IN_CM);
  });
  it("straw goes down about 2 in deep", () => {
    expect(LAYER_DEPTH_CM.straw.default / IN_CM).toBeCloseTo(2, 0);
  });
  it("each default sits inside its allowed range", () => {
    for (const r of Object.values(LAYER_DEPTH_CM)) {
      expect(r.default).toBeGreaterThanOrEqual(r.min);
      expect(r.default).toBeLessThanOrEqual(r.max);
    }
  });
});

describe("layerVolume", () => {
  it("is area × depth", () => {
    // 4.8 m² × 0.125 m = 0.6 m³
    expect(layerVolume(4.8, 12.5)).toBeCloseTo(0.6, 12);
  });
  it("an inch over an acre is 27,154 US gal (University of Georgia Extension)", () => {
    // acre = 43,560 ft² × 0.09290304 m²/ft² (NIST HB44); gal = 0.003785411784 m³
    expect(layerVolume(43_560 * 0.09290304, IN_CM) / 0.003785411784).toBeCloseTo(27_154.29, 1);
  });
  it("rejects negative or non-finite input", () => {
    expect(() => layerVolume(-1, 5)).toThrow(RangeError);
    expect(() => layerVolume(1, Number.NaN)).toThrow(RangeError);
  });
  it("scales linearly with area (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 10_000, noNaN: true }),
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 2, max: 30, noNaN: true }),
        (area, k, depth) => {
          const ratio = layerVolume(area * k, depth) / layerVolume(area, depth);
          expect(ratio).toBeCloseTo(k, 9);
        },
      ),
    );
  });
});

describe("bagsFor and balesFor", () => {
  it("rounds bags up to whole 30-gallon bags", () => {
    // 0.6 m³ / 0.11356 m³ = 5.28 → 6 bags
    expect(bagsFor(0.6)).toBe(6);
    expect(bagsFor(BAG_M3 * 3)).toBe(3);
    expect(bagsFor(0)).toBe(0);
    expect(bagsFor(1, 0.25)).toBe(4);
  });
  it("counts bales from the spread volume each covers", () => {
    // one bale covers 0.14866 m³ × 3 = 0.446 m³; 1 m³ → 2.24 → 3 bales
    expect(balesFor(1)).toBe(3);
    expect(balesFor(BALE_M3 * BALE_EXPANSION_FACTOR * 2)).toBe(2);
    expect(balesFor(1, 0.2, 2)).toBe(3); // 1 / 0.4 = 2.5
    expect(balesFor(0)).toBe(0);
  });
  it("rejects nonsense unit sizes", () => {
    expect(() => bagsFor(1, 0)).toThrow(RangeError);
    expect(() => balesFor(1, BALE_M3, 0.5)).toThrow(RangeError);
  });
});
