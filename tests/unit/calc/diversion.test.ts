import { describe, expect, it } from "vitest";
import { CARDBOARD_KG_PER_M2 } from "@/lib/calc/facts";
import { divertedKg, divertedM3, summariseDiversion } from "@/lib/calc/diversion";

const LB_PER_GAL = 0.45359237 / 0.003785411784; // kg/m³ per lb/US gal, NIST HB44

describe("divertedKg", () => {
  it("passes kilograms through", () => {
    expect(divertedKg("coffee_grounds", 12.5, "kg")).toBe(12.5);
  });

  it("weighs a volume with the Missouri S&T density (horse manure 6.8 lb/gal)", () => {
    expect(divertedKg("manure", 2, "m3")).toBeCloseTo(2 * 6.8 * LB_PER_GAL, 6);
  });

  it("weighs bags of 30 US gal by default (common practice), or the size given", () => {
    // 4 bags × 30 gal × 1 lb/gal (loose leaves, Missouri S&T) = 120 lb = 54.43 kg
    expect(divertedKg("leaves", 4, "bags")).toBeCloseTo(120 * 0.45359237, 6);
    expect(divertedKg("leaves", 4, "bags", 0.2)).toBeCloseTo(0.8 * LB_PER_GAL, 6);
  });

  it("weighs a straw bale at a small bale's usual 45 lb (common practice), or what the supplier says", () => {
    expect(divertedKg("straw", 1, "bales") / 0.45359237).toBeCloseTo(45, 9);
    expect(divertedKg("straw", 3, "bales", undefined, 20)).toBeCloseTo(60, 12);
  });

  it("weighs a m³ of straw as loose straw, the same as the bed estimate does (45 lb over 15.75 ft³)", () => {
    // 45 lb / (5.25 ft³ × 3) = 2.857 lb/ft³ = 45.77 kg/m³ (NIST HB44: 1 lb/ft³ = 16.018463 kg/m³)
    expect(divertedKg("straw", 1, "m3")).toBeCloseTo((45 / 15.75) * 16.018463, 3);
  });

  it("weighs cardboard by area and by sheet", () => {
    expect(divertedKg("cardboard", 10, "m2")).toBeCloseTo(10 * CARDBOARD_KG_PER_M2, 12);
    // default sheet 1.0 × 0.8 m
    expect(divertedKg("cardboard", 5, "sheets")).toBeCloseTo(5 * 0.8 * CARDBOARD_KG_PER_M2, 12);
    expect(divertedKg("cardboard", 5, "sheets", 2)).toBeCloseTo(10 * CARDBOARD_KG_PER_M2, 12);
  });

  it("uses an areal mass in the 0.4–0.6 kg/m² of single-wall board (from memory)", () => {
    expect(CARDBOARD_KG_PER_M2).toBeGreaterThanOrEqual(0.4);
    expect(CARDBOARD_KG_PER_M2).toBeLessThanOrEqual(0.6);
  });

  it("refuses to weigh loose material by area, and nonsense quantities", () => {
    expect(() => divertedKg("leaves", 10, "m2")).toThrow(RangeError);
    expect(() => divertedKg("leaves", -1, "kg")).toThrow(RangeError);
    expect(() => divertedKg("straw", 1, "bales", 0)).toThrow(RangeError);
  });
});

describe("divertedM3 and summariseDiversion", () => {
  it("passes volumes through and turns weight into loose volume with the bulk density", () => {
    // 30 US gal bag = 0.1135624 m³ (common practice size; NIST HB44 gallon).
    expect(divertedM3("leaves", 2, "bags")).toBeCloseTo(2 * 30 * 0.003785411784, 9);
    expect(divertedM3("wood_chips", 1.5, "m3")).toBe(1.5);
    // 100 kg of coffee grounds ÷ 7 lb/gal (Missouri S&T) = 100 / 838.79 = 0.1192 m³.
    expect(divertedM3("coffee_grounds", 100, "kg")).toBeCloseTo(100 / (7 * LB_PER_GAL), 9);
  });
  it("adds up by month and material, counts households once, and groups giveaway days", () => {
    const s = summariseDiversion([
      { material: "leaves", quantity: 2, unit: "bags", month: "2026-11", household: "a" },
      { material: "leaves", quantity: 3, unit: "bags", month: "2026-11", household: "b", day: { id: "d1", date: "2026-11-14", title: "Leaf day" } },
      { material: "coffee_grounds", quantity: 10, unit: "kg", month: "2026-12", household: "a" },
    ]);
    // 5 bags × 30 gal × 1 lb/gal (Missouri S&T, loose leaves) = 150 lb = 68.039 kg, plus 10 kg.
    expect(s.total_kg).toBeCloseTo(150 * 0.45359237 + 10, 3);
    expect(s.households).toBe(2);
    expect(s.collections).toBe(3);
    expect(s.by_month.map((m) => [m.month, m.material, m.households])).toEqual([
      ["2026-11", "leaves", 2],
      ["2026-12", "coffee_grounds", 1],
    ]);
    expect(s.by_day).toEqual([{ day_id: "d1", date: "2026-11-14", title: "Leaf day", material: "leaves", kg: expect.closeTo(90 * 0.45359237, 3), m3: expect.closeTo(90 * 0.003785411784, 4), households: 1 }]);
    expect(summariseDiversion([])).toMatchObject({ total_kg: 0, households: 0, by_month: [] });
  });
});
