import { describe, expect, it } from "vitest";
import { divertedKg } from "@/lib/calc/diversion";
import { estimate } from "@/lib/calc/estimate";
import type { MaterialCode } from "@/lib/calc/facts";
import { handedVolumeOf, massOf, unitAmount } from "@/lib/calc/mass";
import { formatQuantity } from "@/lib/format/quantity";
import { describeUnitSize } from "@/lib/listings/format";
import { convertNeed, isNeedUnitFor, unitContent } from "@/lib/match/units";
import { equivalentOf } from "@/lib/reservations/equivalents";

// Conversions from NIST HB44 App. C (exact): 1 lb = 0.45359237 kg, 1 US gal = 0.003785411784 m³,
// 1 yd = 0.9144 m, 1 ft = 0.3048 m.
const LB_GAL = 0.45359237 / 0.003785411784; // kg/m³ per lb/US gal = 119.826
const LB_YD3 = 0.45359237 / 0.9144 ** 3; // kg/m³ per lb/yd³ = 0.593276
const LB_FT3 = 0.45359237 / 0.3048 ** 3; // kg/m³ per lb/ft³ = 16.018463

/** One cubic metre of each material loose, kg, from the published figure behind it. */
const PUBLISHED_KG_PER_M3: [MaterialCode, number, string][] = [
  ["cardboard", 0.5 * LB_GAL, "Missouri S&T, 0.5 lb/US gal"],
  ["leaves", 1 * LB_GAL, "Missouri S&T, loose dry leaves 1 lb/US gal"],
  ["grass_clippings", 1.7 * LB_GAL, "Missouri S&T, loose clippings 1.7 lb/US gal"],
  ["coffee_grounds", 7 * LB_GAL, "Missouri S&T, 7 lb/US gal"],
  ["manure", 6.8 * LB_GAL, "Missouri S&T, horse manure 6.8 lb/US gal"],
  ["wood_chips", 473 * LB_YD3, "Oregon DEQ (2005), green chips 473 lb/yd³"],
  ["compost", 1300 * LB_YD3, "middle of 1,000–1,600 lb/yd³, common practice"],
  // A 45 lb small bale (inside the usual 40–60 lb, common practice) of 5.25 ft³, loosened
  // to three times its volume (common practice, no source).
  ["straw", (45 / (5.25 * 3)) * LB_FT3, "45 lb bale over 15.75 ft³, common practice"],
];

describe("one cubic metre of each material weighs the same in every module", () => {
  it.each(PUBLISHED_KG_PER_M3)("%s: %f kg (%s)", (material, kg) => {
    // The one function.
    expect(massOf(material, 1, "m3")).toBeCloseTo(kg, 6);
    // Matching: what a m³ listing holds, and a need converted from m³ to kg.
    expect(unitContent({ material, unit: "m3", unit_size: null, unit_mass_kg: null })!.kg).toBeCloseTo(kg, 6);
    if (isNeedUnitFor(material, "m3")) expect(convertNeed(material, 1, "m3", "kg")).toBeCloseTo(kg, 6);
    // Diversion reports.
    expect(divertedKg(material, 1, "m3")).toBeCloseTo(kg, 6);
    // Listing display (the reserve form's "what it comes to"), rounded as every weight is shown.
    expect(equivalentOf({ material, unit: "m3", unit_size: null, unit_mass_kg: null }, 1, "metric")).toContain(`about ${formatQuantity(kg, "kg", "metric")}`);
  });

  it.each(["leaves", "straw", "wood_chips"] as const)("the bed estimate weighs a 1 m³ layer of %s the same", (material) => {
    // 10 m² at 10 cm is 1 m³.
    const layers = { cardboard: false, leaves: false, straw: false, worms: false, [material]: { depth_cm: 10 } };
    const line = estimate({ bed: { length_m: 5, width_m: 2 }, layers, start_date: "2027-03-01" }).needs.find((n) => n.material === material)!;
    const published = PUBLISHED_KG_PER_M3.find(([m]) => m === material)![1];
    expect((line as { mass_kg: number }).mass_kg).toBeCloseTo(published, 1);
  });
});

describe("bags and bales", () => {
  it("a 30 US gal bag (common practice) of leaves weighs 30 lb at 1 lb/gal (Missouri S&T), everywhere", () => {
    expect(massOf("leaves", 1, "bags")).toBeCloseTo(30 * 0.45359237, 9);
    expect(unitContent({ material: "leaves", unit: "bags", unit_size: null, unit_mass_kg: null })!.kg).toBeCloseTo(30 * 0.45359237, 9);
    expect(divertedKg("leaves", 1, "bags")).toBeCloseTo(30 * 0.45359237, 9);
    // 13.6 kg on the listing page.
    expect(describeUnitSize("bags", 30 * 0.003785411784, null, "metric", "leaves")).toBe("bags of about 114 L, about 13.6 kg");
  });

  it("only straw expands out of the bale: a bale of leaves covers the volume it states", () => {
    const straw = unitAmount("straw", "bales", { unit_size: 0.15 })!;
    const leaves = unitAmount("leaves", "bales", { unit_size: 0.15 })!;
    // Straw: three times the bale (common practice); leaves: as handed over.
    expect(straw.spread_m3).toBeCloseTo(0.45, 12);
    expect(leaves.spread_m3).toBeCloseTo(0.15, 12);
    expect(leaves.kg).toBeCloseTo(0.15 * LB_GAL, 9);
    expect(straw.handed_m3).toBe(0.15);
    expect(unitAmount("wood_chips", "bales")).toBeNull();
    expect(() => massOf("leaves", 1, "bales")).toThrow(/state its volume/);
  });

  it("a straw bale's stated weight wins wherever it is weighed", () => {
    expect(massOf("straw", 2, "bales", { unit_mass_kg: 22 })).toBe(44);
    expect(unitContent({ material: "straw", unit: "bales", unit_size: null, unit_mass_kg: 22 })!.kg).toBe(22);
    expect(divertedKg("straw", 2, "bales", undefined, 22)).toBe(44);
  });

  it("hands over cardboard flat at 4 mm a layer (from memory) and bags at their own volume", () => {
    expect(handedVolumeOf("cardboard", 10, "sheets", { unit_size: 0.8 })).toBeCloseTo(10 * 0.8 * 0.004, 12);
    expect(handedVolumeOf("leaves", 2, "bags")).toBeCloseTo(2 * 30 * 0.003785411784, 12);
  });

  it("refuses units that make no sense for a material, and negative quantities", () => {
    expect(unitAmount("leaves", "sheets")).toBeNull();
    expect(unitAmount("worms", "m3")).toBeNull();
    expect(() => massOf("leaves", 1, "m2")).toThrow(RangeError);
    expect(() => massOf("leaves", -1, "m3")).toThrow(RangeError);
  });
});
