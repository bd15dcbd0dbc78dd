import { describe, expect, it } from "vitest";
import { fitLine, fitOf } from "@/components/listings/bed-fit";

// A 30 US gal paper leaf bag (common practice, no source) is 30 × 0.003785411784 m³ (NIST HB44) = 0.11356 m³.
const BAG_M3 = 30 * 0.003785411784;

describe("a listing against what a bed still needs", () => {
  it("counts whole bags: 0.45 m³ of leaves is 0.45 / 0.11356 = 3.96, so 4 bags", () => {
    expect(fitOf({ material: "leaves", unit: "bags", quantity_available: 10 }, { material: "leaves", unit: "m3", quantity: 0.45 })).toEqual({ needed: 4, covered: 4 });
    expect(0.45 / BAG_M3).toBeCloseTo(3.96, 2);
  });

  it("says how much of the need a smaller listing covers", () => {
    const need = { material: "leaves" as const, unit: "m3" as const, quantity: 12 * BAG_M3 };
    expect(fitLine({ material: "leaves", unit: "bags", quantity_available: 6 }, need, "Plot 4", "metric")).toBe("covers 6 of the 12 bags still needed for Plot 4");
    expect(fitLine({ material: "leaves", unit: "bags", quantity_available: 20 }, need, "Plot 4", "metric")).toBe("covers all 12 bags still needed for Plot 4");
  });

  it("says so when the bed does not need the material, or has it already", () => {
    expect(fitLine({ material: "straw", unit: "bales", quantity_available: 3 }, undefined, "Plot 4", "metric")).toBe("Plot 4 does not need straw");
    expect(fitLine({ material: "leaves", unit: "bags", quantity_available: 3 }, { material: "leaves", unit: "m3", quantity: 0 }, "Plot 4", "metric")).toBe("Plot 4 already has all the fallen leaves it needs");
  });
});
