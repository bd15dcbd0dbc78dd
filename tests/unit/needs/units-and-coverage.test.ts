// A need typed in a gardener's own units becomes SI, and what reservations already cover is
// counted in the need's unit; one click reserves what is still lacking, in whole bags.
import { describe, expect, it } from "vitest";
import { fromSiNeed, needInputUnits, toSiNeed, formatNeedQuantity } from "@/lib/needs/units";
import { amountToReserve, counts, coverage, isMet, type CountedReservation, type CoveredNeed } from "@/lib/needs/coverage";
import { reachBand, REACH_BANDS_KM } from "@/lib/needs/reach";

describe("a need in the gardener's units", () => {
  it("offers bags and volume for leaves, area for cardboard, weight for worms", () => {
    expect(needInputUnits("leaves", "metric").map((u) => u.code)).toEqual(["bags", "m3", "kg"]);
    expect(needInputUnits("leaves", "imperial").map((u) => u.code)).toEqual(["bags", "yd3", "lb"]);
    expect(needInputUnits("cardboard", "imperial").map((u) => u.code)).toEqual(["ft2", "lb"]);
    expect(needInputUnits("worms", "metric").map((u) => u.code)).toEqual(["kg"]);
  });
  it("turns each into SI", () => {
    // 12 paper lawn-and-leaf bags of 30 US gal (common practice, no source) = 360 gal;
    // NIST HB44: 1 gal = 231 in³ = 3.785411784 L, so 1.36274824 m³.
    expect(toSiNeed(12, "bags").quantity).toBeCloseTo(1.36274824, 8);
    expect(toSiNeed(12, "bags").unit).toBe("m3");
    // NIST HB44: 1 yd = 0.9144 m, so 2 yd³ = 1.52910972 m³.
    expect(toSiNeed(2, "yd3").quantity).toBeCloseTo(1.52910972, 8);
    // NIST HB44: 1 ft = 0.3048 m, so 100 ft² = 9.290304 m².
    expect(toSiNeed(100, "ft2")).toEqual({ quantity: expect.closeTo(9.290304, 9), unit: "m2" });
    // NIST HB44: 1 lb = 0.45359237 kg exactly.
    expect(toSiNeed(10, "lb").quantity).toBeCloseTo(4.5359237, 9);
    expect(fromSiNeed(toSiNeed(7, "bags").quantity, "bags")).toBeCloseTo(7, 9);
  });
  it("reads a loose volume back with the bags it makes", () => {
    expect(formatNeedQuantity(0.45, "m3", "leaves", "metric")).toBe("0.45 m³ (about 4 bags)");
    expect(formatNeedQuantity(3.6, "m2", "cardboard", "metric")).toBe("3.6 m²");
    expect(formatNeedQuantity(0, "m3", "leaves", "metric")).toBe("0 m³");
  });
});

describe("reach bands", () => {
  it("files a radius under the smallest band holding it, and refuses past 50 km", () => {
    expect([0.5, 2, 2.01, 5, 9.9, 25, 26, 50].map(reachBand)).toEqual([2, 2, 5, 5, 10, 25, 50, 50]);
    expect(() => reachBand(50.01)).toThrow(RangeError);
    expect(() => reachBand(0)).toThrow(RangeError);
    expect(REACH_BANDS_KM.at(-1)).toBe(50);
  });
});

describe("coverage by reservations", () => {
  const need: CoveredNeed = { id: "n1", bed_id: "bed1", material_code: "leaves", quantity: 0.4, unit: "m3", created_at: "2026-12-01T10:00:00.000Z" };
  const bags = (over: Partial<CountedReservation>): CountedReservation => ({
    need_id: null,
    bed_id: null,
    status: "confirmed",
    quantity: 2,
    created_at: "2026-12-02T10:00:00.000Z",
    material_code: "leaves",
    unit: "bags",
    unit_size: 0.1,
    unit_mass_kg: null,
    ...over,
  });
  it("counts a reservation made for the need, or for its bed and material after it was opened", () => {
    expect(counts(need, bags({ need_id: "n1" }))).toBe(true);
    expect(counts(need, bags({ need_id: "other" }))).toBe(false);
    expect(counts(need, bags({ bed_id: "bed1" }))).toBe(true);
    expect(counts(need, bags({ bed_id: "bed1", created_at: "2026-11-30T10:00:00.000Z" }))).toBe(false);
    expect(counts(need, bags({ bed_id: "bed1", material_code: "straw" }))).toBe(false);
    expect(counts(need, bags({ bed_id: "bed2" }))).toBe(false);
  });
  it("is met by confirmed or collected reservations only; a hold is reserved but not yet met", () => {
    const held = coverage(need, [bags({ need_id: "n1", status: "held", quantity: 4 })]);
    expect(held).toEqual({ reserved: expect.closeTo(0.4, 9), settled: 0 });
    expect(isMet(need, held)).toBe(false);
    const done = coverage(need, [bags({ need_id: "n1", quantity: 2 }), bags({ bed_id: "bed1", status: "collected", quantity: 2 })]);
    expect(isMet(need, done)).toBe(true);
  });
});

describe("what one click reserves", () => {
  const leafBags = { material: "leaves" as const, unit: "bags" as const, unit_size: 0.1136, unit_mass_kg: null, available: 10, max_per_reservation: null };
  it("rounds up to whole bags, and stops at what is left and what one person may take", () => {
    expect(amountToReserve(0.4, "m3", leafBags)).toBe(4); // 3.5 bags
    expect(amountToReserve(0.4, "m3", { ...leafBags, available: 3 })).toBe(3);
    expect(amountToReserve(0.4, "m3", { ...leafBags, max_per_reservation: 2 })).toBe(2);
    expect(amountToReserve(0, "m3", leafBags)).toBe(0);
  });
  it("measures loose units to the hundredth, and sheets by their area", () => {
    expect(amountToReserve(12.341, "kg", { material: "coffee_grounds", unit: "kg", unit_size: null, unit_mass_kg: null, available: 40, max_per_reservation: null })).toBe(12.35);
    expect(amountToReserve(3.6, "m2", { material: "cardboard", unit: "sheets", unit_size: 0.8, unit_mass_kg: null, available: 25, max_per_reservation: null })).toBe(5);
  });
});
