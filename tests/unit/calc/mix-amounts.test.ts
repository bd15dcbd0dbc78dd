import { describe, expect, it } from "vitest";
import { mixUnitKg, mixUnitsFor } from "@/lib/calc/mix-amounts";

// Conversions from NIST HB44 App. C (exact): 1 lb = 0.45359237 kg, 1 US gal = 0.003785411784 m³.
const LB_GAL = 0.45359237 / 0.003785411784; // kg/m³ per lb/US gal

describe("amounts the way people have them, in kg", () => {
  it("a 10 L bucket of spent coffee grounds: 7 lb/US gal (Missouri S&T) × 0.010 m³ (a 10 L bucket, common practice, no source)", () => {
    expect(mixUnitKg("coffee_grounds", "buckets")).toBeCloseTo(7 * LB_GAL * 0.01, 6); // 8.39 kg
  });

  it("an 80 L barrow of loose dry leaves: 1 lb/US gal (Missouri S&T) × 0.080 m³ (an 80 L barrow, common practice, no source)", () => {
    expect(mixUnitKg("leaves", "barrows")).toBeCloseTo(1 * LB_GAL * 0.08, 6); // 9.59 kg
  });

  it("a 30 US gal paper leaf bag of loose clippings: 1.7 lb/US gal × 30 gal = 51 lb (Missouri S&T density; bag size common practice, no source)", () => {
    expect(mixUnitKg("grass_clippings", "bags")).toBeCloseTo(51 * 0.45359237, 6);
  });

  it("a small straw bale: 45 lb, inside the usual 40–60 lb (common practice, no source)", () => {
    expect(mixUnitKg("straw", "bales")).toBeCloseTo(45 * 0.45359237, 6);
  });

  it("kg is kg for anything, named or not", () => {
    expect(mixUnitKg(undefined, "kg")).toBe(1);
    expect(mixUnitKg("compost", "kg")).toBe(1);
  });

  it("offers only the units that fit: no bale of grounds, no bucket of something unnamed", () => {
    expect(mixUnitsFor("coffee_grounds")).toEqual(["buckets", "barrows", "bags", "kg"]);
    expect(mixUnitsFor("straw")).toEqual(["buckets", "barrows", "bags", "bales", "kg"]);
    expect(mixUnitsFor(undefined)).toEqual(["kg"]);
  });
});
