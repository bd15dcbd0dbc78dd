import { describe, expect, it } from "vitest";
import { WORM_STOCKING_KG_PER_M2 } from "@/lib/calc/facts";
import { wormsFor } from "@/lib/calc/worms";

describe("wormsFor", () => {
  it("stocks by weight and counts about 1,000 worms per pound (common practice)", () => {
    // 10 m² × 0.5 kg/m² = 5 kg = 11.023 lb → about 11,023 worms.
    const r = wormsFor(10, 0.5);
    expect(r.kg).toBeCloseTo(5, 12);
    expect(r.count).toBe(Math.round((5 / 0.45359237) * 1000));
    expect(r.count).toBe(11_023);
  });

  it("defaults to the named stocking density (no published figure for outdoor beds)", () => {
    expect(wormsFor(4).kg).toBeCloseTo(4 * WORM_STOCKING_KG_PER_M2, 12);
  });

  it("rejects negative input", () => {
    expect(() => wormsFor(-1)).toThrow(RangeError);
    expect(() => wormsFor(1, -0.1)).toThrow(RangeError);
  });
});
