// Prices per unit, typed quantities and input units in the viewer's system. Expected values
// are worked by hand from the exact definitions: 1 lb = 0.45359237 kg and 1 yd = 0.9144 m
// (International Yard and Pound Agreement, 1959; NIST Handbook 44 Appendix C), so
// 1 yd³ = 0.764554857984 m³ and 1 ft² = 0.09290304 m²; 1 mi = 1.609344 km (same source).
import { describe, expect, it } from "vitest";
import { formatPrice } from "@/lib/listings/format";
import { quantityLimitProblem, typedQuantityLabel } from "@/lib/reservations/labels";
import { inputUnit } from "@/lib/calc/units";
import { formatGiveawayQuantity, formatTypedGiveawayQuantity } from "@/lib/format/giveaway";
import { unitsFor } from "@/lib/units/preference";
import { listingCautions, smallBaleText } from "@/lib/calc/cautions";
import { pickupCautions } from "@/lib/reservations/cautions";
import { formatKg, formatM3 } from "@/components/reports/format";

describe("a price per unit for an imperial reader", () => {
  it("€6.00 a kg is €2.72 a lb (600 × 0.45359237 = 272.2 cents)", () => {
    expect(formatPrice(600, "eur", "kg", "imperial")).toBe("€2.72 a lb");
    expect(formatPrice(600, "eur", "kg")).toBe("€6.00 a kg");
  });
  it("€20.00 a m³ is €15.29 a yd³ (2000 × 0.764554857984 = 1529.1 cents)", () => {
    expect(formatPrice(2000, "eur", "m3", "imperial")).toBe("€15.29 a yd³");
  });
  it("pieces and free stay as they are", () => {
    expect(formatPrice(400, "eur", "bales", "imperial")).toBe("€4.00 a bale");
    expect(formatPrice(0, "eur", "kg", "imperial")).toBe("Free");
  });
});

describe("a quantity typed in the listing's unit", () => {
  it("leads with the reader's unit and keeps the typed one beside it: 2 kg is 4.4 lb (2 / 0.45359237 = 4.41)", () => {
    expect(typedQuantityLabel(2, "kg", "imperial")).toBe("4.4 lb (2 kg)");
    expect(typedQuantityLabel(2, "kg", "metric")).toBe("2 kg");
    expect(typedQuantityLabel(3, "bags", "imperial")).toBe("3 bags");
  });
  it("says the tighter limit in the reader's units", () => {
    expect(quantityLimitProblem(9, { available: 8, max_per_reservation: 10, unit: "bags" }, "imperial")).toBe("Only 8 bags left.");
    expect(quantityLimitProblem(3, { available: 8, max_per_reservation: 2, unit: "kg" }, "imperial")).toBe("At most 4.4 lb (2 kg) per reservation on this listing.");
  });
  it("a giveaway's 0.5 m³ is 17.7 ft³ (0.5 / 0.028316846592 = 17.66)", () => {
    expect(formatGiveawayQuantity(0.5, "m3", "imperial")).toBe("17.7 ft³");
    expect(formatTypedGiveawayQuantity(0.5, "m3", "imperial")).toBe("17.7 ft³ (0.5 m³)");
    expect(formatTypedGiveawayQuantity(2, "bags", "imperial")).toBe("2 bags");
  });
});

describe("the unit a field is typed in", () => {
  it("miles for a radius: 10 mi is 16.09344 km", () => {
    const u = inputUnit("km", "imperial");
    expect(u.symbol).toBe("mi");
    expect(u.toSI(10)).toBeCloseTo(16.09344, 9);
    expect(u.fromSI(16.09344)).toBeCloseTo(10, 9);
  });
  it("cubic yards for bulk, pounds for weight, square feet for area", () => {
    expect(inputUnit("m3", "imperial").toSI(1)).toBeCloseTo(0.764554857984, 12);
    expect(inputUnit("kg", "imperial").toSI(1)).toBeCloseTo(0.45359237, 12);
    expect(inputUnit("m2", "imperial").toSI(1)).toBeCloseTo(0.09290304, 12);
    expect(inputUnit("m3", "metric")).toMatchObject({ symbol: "m³" });
  });
});

describe("whose units a page is read in", () => {
  it("the device's cookie, then the account's choice, then metric", () => {
    expect(unitsFor("imperial", "metric")).toBe("imperial");
    expect(unitsFor(undefined, "imperial")).toBe("imperial");
    expect(unitsFor("nonsense", null)).toBe("metric");
  });
});

describe("cautions in the reader's units", () => {
  // NIOSH recommended weight limit: 51 lb (23 kg) under ideal conditions (NIOSH lifting equation).
  it("a 25 kg bale reads in pounds alone for an imperial reader (25 / 0.45359237 = 55 lb)", () => {
    const lifting = listingCautions({ material: "straw", unit: "bales", unit_mass_kg: 25, quality: { herbicide_history: "unknown" } }, "imperial").find((c) => c.kind === "lifting")!;
    expect(lifting.text).toContain("Each bale weighs about 55 lb, over the 51 lb NIOSH limit");
    expect(lifting.text).not.toMatch(/\bkg\b/);
  });
  it("the planner's bale note likewise, and metric readers keep both", () => {
    expect(smallBaleText("imperial")).not.toMatch(/\bkg\b/);
    expect(smallBaleText("metric")).toMatch(/kg \(\d+–\d+ lb\)/);
    expect(pickupCautions({ material: "straw", unit: "bales", unit_mass_kg: 20 }, "imperial").join(" ")).toContain("about 44 lb each; NIOSH puts the limit for one lift at 51 lb");
  });
});

describe("the reports' totals in the reader's units", () => {
  it("228 kg is 503 lb (228 / 0.45359237 = 502.7); 2.4 m³ is 3.14 yd³ (2.4 / 0.764554857984)", () => {
    expect(formatKg(228)).toBe("228 kg");
    expect(formatKg(228, "imperial")).toBe("503 lb");
    expect(formatM3(2.4)).toBe("2.40 m³");
    expect(formatM3(2.4, "imperial")).toBe("3.14 yd³");
  });
});
