import { describe, expect, it } from "vitest";
import { assertNonNegativeFinite, assertPositiveFinite, ceilWhole, roundTo } from "@/lib/calc/numbers";

describe("numeric helpers", () => {
  it("ceilWhole ignores float dust but rounds real fractions up", () => {
    expect(ceilWhole((2.7 - 0.15) / (1.0 - 0.15))).toBe(3); // 3.0000000000000004 in IEEE 754
    expect(ceilWhole(3.01)).toBe(4);
    expect(ceilWhole(0)).toBe(0);
    expect(ceilWhole(-2)).toBe(0);
  });
  it("roundTo rounds to the given places", () => {
    expect(roundTo(71.89585, 2)).toBe(71.9);
    expect(roundTo(0.60049, 3)).toBe(0.6);
  });
  it("the assertions throw RangeError on bad numbers only", () => {
    expect(() => assertPositiveFinite("x", 0)).toThrow(RangeError);
    expect(() => assertNonNegativeFinite("x", Number.NaN)).toThrow(RangeError);
    expect(() => assertNonNegativeFinite("x", 0)).not.toThrow();
    expect(() => assertPositiveFinite("x", 1e-12)).not.toThrow();
  });
});
