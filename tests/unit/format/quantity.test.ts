import { describe, expect, it } from "vitest";
import { formatCount, formatDistance, formatQuantity, formatRange, roundCount, roundLitres, roundUsGallons } from "@/lib/format/quantity";

// Conversions are NIST HB44 (exact); the rounding is ours: what a person can measure out.
describe("formatQuantity", () => {
  it("shows SI values in metric with their symbols", () => {
    expect(formatQuantity(12.5, "cm", "metric")).toBe("12.5 cm");
    expect(formatQuantity(4.8, "m2", "metric")).toBe("4.8 m²");
    expect(formatQuantity(0.6, "m3", "metric")).toBe("0.6 m³");
    expect(formatQuantity(0.45, "m3", "metric")).toBe("0.45 m³");
  });

  it("rounds distances to tenths, whole past ten: 0.888 km is 0.9 km", () => {
    expect(formatQuantity(0.888, "km", "metric")).toBe("0.9 km");
    expect(formatQuantity(11.2, "km", "metric")).toBe("11 km");
    expect(formatQuantity(11.2, "km", "imperial")).toBe("7 mi"); // 11.2 / 1.609344 = 6.96
    expect(formatQuantity(3, "km", "imperial")).toBe("1.9 mi"); // 1.864
  });

  it("shows an area of land in km² or, for imperial readers, square miles", () => {
    expect(formatQuantity(1, "km2", "metric")).toBe("1 km²");
    expect(formatQuantity(1.23, "km2", "metric")).toBe("1.23 km²");
    // 1 mi² = 1.609344² km² = 2.589988110336 km² (NIST HB44 App. C): 1 km² = 0.386 mi².
    expect(formatQuantity(1, "km2", "imperial")).toBe("0.386 mi²");
    expect(formatQuantity(2.589988110336, "km2", "imperial")).toBe("1 mi²");
  });

  it("pours water to the litre under 10, then 5 L, then 10 L; gallons to the half, whole, then 5", () => {
    expect(formatQuantity(41.83, "l", "metric")).toBe("40 L");
    expect(formatQuantity(43, "l", "metric")).toBe("45 L");
    expect(formatQuantity(7.4, "l", "metric")).toBe("7 L");
    expect(formatQuantity(236, "l", "metric")).toBe("240 L");
    expect(formatQuantity(3.785411784, "l", "imperial")).toBe("1 US gal");
    expect(formatQuantity(41.83, "l", "imperial")).toBe("11 US gal"); // 11.05
    expect(formatQuantity(236, "l", "imperial")).toBe("60 US gal"); // 62.3
  });

  it("shows depths to a tenth under 10 and weights to what a scale shows", () => {
    expect(formatQuantity(12.5, "cm", "imperial")).toBe("4.9 in"); // 12.5 / 2.54 = 4.921
    expect(formatQuantity(30, "cm", "imperial")).toBe("12 in"); // 11.81
    expect(formatQuantity(23, "kg", "imperial")).toBe("51 lb"); // 23 / 0.45359237 = 50.71
    expect(formatQuantity(2.4, "kg", "metric")).toBe("2.4 kg");
    expect(formatQuantity(0.45, "kg", "metric")).toBe("0.45 kg");
    expect(formatQuantity(12_345, "kg", "metric")).toBe("12,300 kg");
    expect(formatQuantity(0, "kg", "imperial")).toBe("0 lb");
  });

  it("keeps lengths and areas to three figures, and uses cubic feet below a cubic yard", () => {
    expect(formatQuantity(1, "m", "imperial")).toBe("3.28 ft");
    expect(formatQuantity(10, "m2", "imperial")).toBe("108 ft²"); // 107.64
    expect(formatQuantity(0.6, "m3", "imperial")).toBe("21.2 ft³"); // 0.6 / 0.0283168 = 21.19
    expect(formatQuantity(1.5, "m3", "imperial")).toBe("1.96 yd³"); // 1.5 / 0.764555 = 1.962
  });
});

describe("counts and ranges", () => {
  it("gives worms as about two figures: 11,023 is about 11,000", () => {
    expect(roundCount(11_023)).toBe(11_000);
    expect(formatCount(11_023)).toBe("about 11,000");
    expect(formatCount(5_291)).toBe("about 5,300");
    expect(formatCount(42)).toBe("about 42");
  });

  it("never rounds some water down to none", () => {
    expect(roundLitres(0.4)).toBe(1);
    expect(roundLitres(0)).toBe(0);
    expect(roundUsGallons(0.1)).toBe(0.5);
  });

  it("writes a range once in its unit, or one figure when both ends round alike", () => {
    expect(formatRange(31, 67, "l", "metric")).toBe("30–65 L");
    expect(formatRange(31, 32, "l", "metric")).toBe("30 L");
    expect(formatRange(31, 67, "l", "imperial")).toBe("8–18 US gal"); // 8.19, 17.7
  });
});

describe("formatDistance", () => {
  it("says how far away a place is, metres under a kilometre", () => {
    expect(formatDistance(0.42)).toBe("about 400 m");
    expect(formatDistance(0.02)).toBe("about 100 m");
    expect(formatDistance(3.24)).toBe("about 3.2 km");
    expect(formatDistance(12.6)).toBe("about 13 km");
    // 5 km / 1.609344 km per mile (NIST HB44 App. C: 1 mi = 5,280 ft) = 3.107 mi.
    expect(formatDistance(5, "imperial")).toBe("about 3.1 mi");
    // 0.5 km = 0.311 mi: short trips stay in tenths of a mile.
    expect(formatDistance(0.5, "imperial")).toBe("about 0.3 mi");
  });
});
