import { describe, expect, it } from "vitest";
import { BAG_M3, BALE_EXPANSION_FACTOR, BALE_M3, CARDBOARD_KG_PER_M2, MATERIALS } from "@/lib/calc/facts";
import { convertNeed, needPerListingUnit, unitContent } from "@/lib/match/units";

const KG_M3_PER_LB_PER_GAL = 0.45359237 / 0.003785411784; // NIST HB44: lb and US gallon, exact

describe("what one listing unit holds", () => {
  it("a sheet lays its own area; a m² listing one m²", () => {
    expect(needPerListingUnit({ material: "cardboard", unit: "sheets", unit_size: 0.6, unit_mass_kg: null }, "m2")).toBe(0.6);
    expect(needPerListingUnit({ material: "cardboard", unit: "m2", unit_size: null, unit_mass_kg: null }, "m2")).toBe(1);
  });
  it("a kg of cardboard lays 1 / 0.5 = 2 m² (areal mass from lib/calc, from memory)", () => {
    expect(needPerListingUnit({ material: "cardboard", unit: "kg", unit_size: null, unit_mass_kg: null }, "m2")).toBeCloseTo(1 / CARDBOARD_KG_PER_M2, 12);
  });
  it("a bag of leaves spreads to its own volume; a bale of straw to its volume × the expansion factor", () => {
    expect(needPerListingUnit({ material: "leaves", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null }, "m3")).toBeCloseTo(BAG_M3, 12);
    // 14 × 18 × 36 in = 0.1487 m³ in the bale, × 3 once loosened = 0.446 m³ on the bed.
    expect(needPerListingUnit({ material: "straw", unit: "bales", unit_size: BALE_M3, unit_mass_kg: 20 }, "m3")).toBeCloseTo(BALE_M3 * BALE_EXPANSION_FACTOR, 12);
    expect(BALE_M3 * BALE_EXPANSION_FACTOR).toBeCloseTo(0.446, 3);
  });
  it("a bale weighs what the supplier says, or a small bale's usual 45 lb (common practice)", () => {
    expect(unitContent({ material: "straw", unit: "bales", unit_size: BALE_M3, unit_mass_kg: 25 })!.kg).toBe(25);
    expect(unitContent({ material: "straw", unit: "bales", unit_size: BALE_M3, unit_mass_kg: null })!.kg).toBeCloseTo(45 * 0.45359237, 9);
  });
  it("a bale of leaves or chips has no straw to expand: it spreads to the volume it states, and without one it cannot be compared", () => {
    expect(needPerListingUnit({ material: "leaves", unit: "bales", unit_size: 0.3, unit_mass_kg: null }, "m3")).toBeCloseTo(0.3, 12);
    expect(needPerListingUnit({ material: "wood_chips", unit: "bales", unit_size: 0.2, unit_mass_kg: null }, "m3")).toBeCloseTo(0.2, 12);
    expect(needPerListingUnit({ material: "leaves", unit: "bales", unit_size: null, unit_mass_kg: null }, "m3")).toBeNull();
  });
  it("a kg of leaves is 1 / 119.8 m³ (Missouri S&T: loose dry leaves 1 lb/US gal)", () => {
    expect(needPerListingUnit({ material: "leaves", unit: "kg", unit_size: null, unit_mass_kg: null }, "m3")).toBeCloseTo(1 / KG_M3_PER_LB_PER_GAL, 12);
  });
  it("a kg of coffee grounds is 1 / 838.8 m³ (Missouri S&T: 7 lb/US gal)", () => {
    expect(needPerListingUnit({ material: "coffee_grounds", unit: "kg", unit_size: null, unit_mass_kg: null }, "m3")).toBeCloseTo(1 / (7 * KG_M3_PER_LB_PER_GAL), 12);
    expect(MATERIALS.coffee_grounds.bulk_density_kg_m3).toBeCloseTo(838.8, 1);
  });
  it("refuses comparisons that make no sense", () => {
    expect(needPerListingUnit({ material: "leaves", unit: "sheets", unit_size: 1, unit_mass_kg: null }, "m3")).toBeNull();
    expect(needPerListingUnit({ material: "worms", unit: "bags", unit_size: 0.1, unit_mass_kg: null }, "kg")).toBeNull();
    expect(needPerListingUnit({ material: "leaves", unit: "bags", unit_size: 0.1, unit_mass_kg: null }, "m2")).toBeNull();
    expect(needPerListingUnit({ material: "cardboard", unit: "sheets", unit_size: 1, unit_mass_kg: null }, "m3")).toBeNull();
  });
  it("takes the default size when a bag or bale does not state one", () => {
    expect(needPerListingUnit({ material: "leaves", unit: "bags", unit_size: null, unit_mass_kg: null }, "m3")).toBeCloseTo(BAG_M3, 12);
    expect(needPerListingUnit({ material: "straw", unit: "bales", unit_size: null, unit_mass_kg: null }, "m3")).toBeCloseTo(BALE_M3 * BALE_EXPANSION_FACTOR, 12);
  });
  it("takes flat cardboard at 4 L a m² and a bag at its own volume in the car", () => {
    expect(unitContent({ material: "cardboard", unit: "sheets", unit_size: 0.8, unit_mass_kg: null })!.volume_l).toBeCloseTo(3.2, 9);
    expect(unitContent({ material: "leaves", unit: "bags", unit_size: BAG_M3, unit_mass_kg: null })!.volume_l).toBeCloseTo(113.56, 2);
  });
});

describe("converting a need between units", () => {
  it("goes through the bulk density and back", () => {
    const kg = convertNeed("leaves", 0.45, "m3", "kg");
    expect(kg).toBeCloseTo(0.45 * KG_M3_PER_LB_PER_GAL, 9);
    expect(convertNeed("leaves", kg, "kg", "m3")).toBeCloseTo(0.45, 12);
  });
  it("weighs a m³ of spread straw as a 45 lb bale (common practice) spread over three times its 5.25 ft³", () => {
    // 45 lb / (5.25 ft³ × 3) = 2.857 lb/ft³ × 16.018463 kg/m³ per lb/ft³ (NIST HB44) = 45.77 kg/m³
    expect(convertNeed("straw", 1, "m3", "kg")).toBeCloseTo((45 / (5.25 * 3)) * 16.018463, 3);
  });
  it("refuses units a material is not measured in", () => {
    expect(() => convertNeed("worms", 1, "kg", "m3")).toThrow(RangeError);
  });
});
