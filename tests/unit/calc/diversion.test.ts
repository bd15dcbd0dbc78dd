import { describe, expect, it } from "vitest";
import { CARDBOARD_KG_PER_M2 } from "@/lib/calc/facts";
import { divertedKg } from "@/lib/calc/diversion";

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

  it("weighs a bale as compressed straw: 5.25 ft³ × 7.48 gal/ft³ × 1 lb/gal ≈ 39.3 lb", () => {
    // 5.25 ft³ = 39.27 gal (NIST HB44: 1 ft³ = 7.480519 gal)
    expect(divertedKg("straw", 1, "bales") / 0.45359237).toBeCloseTo(5.25 * 7.480519, 3);
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
