import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { waterToTarget } from "@/lib/calc/water";

describe("waterToTarget", () => {
  it("brings 10 kg of leaves at 38 % to 55 %", () => {
    // By hand: dry 6.2 kg; at 55 % the wet mass is 6.2 / 0.45 = 13.778 kg; water 3.778 L.
    expect(waterToTarget([{ mass_kg: 10, moisture_pct: 38 }], 55)).toBeCloseTo(3.7778, 4);
  });

  it("agrees with Cornell's moisture formula, Q2 = Q1·(G − M1)/(M2 − G), with water as material 2", () => {
    // Cornell, "Getting the Right Mix": water has M2 = 100 %. 20 kg of straw at 12 % to G = 60 %:
    // Q2 = 20 × (60 − 12) / (100 − 60) = 24 kg.
    expect(waterToTarget([{ mass_kg: 20, moisture_pct: 12 }], 60)).toBeCloseTo(24, 10);
  });

  it("defaults to 55 %", () => {
    expect(waterToTarget([{ mass_kg: 10, moisture_pct: 38 }])).toBeCloseTo(waterToTarget([{ mass_kg: 10, moisture_pct: 38 }], 55), 12);
  });

  it("asks for nothing when the mix is already wetter than the target", () => {
    expect(waterToTarget([{ mass_kg: 5, moisture_pct: 82 }], 55)).toBe(0);
  });

  it("is never negative (fast-check)", () => {
    const component = fc.record({
      mass_kg: fc.double({ min: 0, max: 1e5, noNaN: true }),
      moisture_pct: fc.double({ min: 0, max: 99, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(component, { maxLength: 10 }), fc.double({ min: 1, max: 95, noNaN: true }), (parts, target) => {
        expect(waterToTarget(parts, target)).toBeGreaterThanOrEqual(0);
      }),
    );
  });

  it("lands the mix on the target whenever water is added (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 1000, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 41, max: 90, noNaN: true }),
        (mass, moisture, target) => {
          const w = waterToTarget([{ mass_kg: mass, moisture_pct: moisture }], target);
          const after = (mass * moisture + 100 * w) / (mass + w);
          expect(after).toBeCloseTo(target, 6);
        },
      ),
    );
  });

  it("rejects an impossible target", () => {
    expect(() => waterToTarget([{ mass_kg: 1, moisture_pct: 10 }], 100)).toThrow(RangeError);
  });
});
