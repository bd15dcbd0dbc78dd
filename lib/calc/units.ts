// Everything is stored and computed in SI; this is the one place that turns it into what a
// gardener reads. Every factor comes from the exact NIST definitions in facts.ts.
import { FEET_PER_MILE, FOOT_M, INCH_M, LITRE_M3, POUND_KG, US_GALLON_M3, YARD_M } from "./facts";

export type UnitSystem = "metric" | "imperial";

/** The one set of units a material changes hands in (listings.unit, giveaway and diversion amounts). */
export const LISTING_UNITS = ["sheets", "m2", "bags", "m3", "bales", "kg"] as const;
export type ListingUnit = (typeof LISTING_UNITS)[number];
/** Sheets, bags and bales change hands whole; m², m³ and kg can be measured out. */
export const WHOLE_UNITS: ReadonlySet<string> = new Set<ListingUnit>(["sheets", "bags", "bales"]);
/** What a need is measured in: cardboard by area, loose layers by spread volume, worms by weight. */
export const NEED_UNITS_SI = ["m2", "m3", "kg"] as const;
export type NeedUnit = (typeof NEED_UNITS_SI)[number];
export type DisplayUnit = "m" | "km" | "km2" | "m2" | "m3" | "cm" | "l" | "kg";

const FT3_M3 = FOOT_M ** 3;
const YD3_M3 = YARD_M ** 3;

export const mToFt = (m: number) => m / FOOT_M;
export const kmToMi = (km: number) => (km * 1000) / (FEET_PER_MILE * FOOT_M);
export const miToKm = (mi: number) => (mi * FEET_PER_MILE * FOOT_M) / 1000;
export const ftToM = (ft: number) => ft * FOOT_M;
export const m2ToFt2 = (m2: number) => m2 / FOOT_M ** 2;
export const ft2ToM2 = (ft2: number) => ft2 * FOOT_M ** 2;
export const cmToIn = (cm: number) => cm / 100 / INCH_M;
export const inToCm = (inches: number) => inches * INCH_M * 100;
export const m3ToFt3 = (m3: number) => m3 / FT3_M3;
export const ft3ToM3 = (ft3: number) => ft3 * FT3_M3;
export const m3ToYd3 = (m3: number) => m3 / YD3_M3;
export const yd3ToM3 = (yd3: number) => yd3 * YD3_M3;
export const lToUsGal = (l: number) => (l * LITRE_M3) / US_GALLON_M3;
export const usGalToL = (gal: number) => (gal * US_GALLON_M3) / LITRE_M3;
export const m3ToUsGal = (m3: number) => m3 / US_GALLON_M3;
export const kgToLb = (kg: number) => kg / POUND_KG;
export const lbToKg = (lb: number) => lb * POUND_KG;

/** An SI value in the unit a gardener using `system` would expect, with its symbol. */
export function toDisplay(
  value: number,
  unit: DisplayUnit,
  system: UnitSystem,
): { value: number; symbol: string } {
  if (system === "metric") return { value, symbol: METRIC_SYMBOL[unit] };
  switch (unit) {
    case "m":
      return { value: mToFt(value), symbol: "ft" };
    case "km":
      return { value: kmToMi(value), symbol: "mi" };
    case "m2":
      return { value: m2ToFt2(value), symbol: "ft²" };
    case "km2":
      // A mile squared: the square of the exact mile (NIST HB44 App. C).
      return { value: value / miToKm(1) ** 2, symbol: "mi²" };
    case "cm":
      return { value: cmToIn(value), symbol: "in" };
    case "m3": {
      // Bed-sized volumes read better in cubic feet; a load from a supplier in cubic yards.
      const yd3 = m3ToYd3(value);
      return Math.abs(yd3) >= 1 ? { value: yd3, symbol: "yd³" } : { value: m3ToFt3(value), symbol: "ft³" };
    }
    case "l":
      return { value: lToUsGal(value), symbol: "US gal" };
    case "kg":
      return { value: kgToLb(value), symbol: "lb" };
  }
}

const METRIC_SYMBOL: Record<DisplayUnit, string> = {
  m: "m",
  km: "km",
  km2: "km²",
  m2: "m²",
  m3: "m³",
  cm: "cm",
  l: "L",
  kg: "kg",
};

/**
 * The unit a person types a quantity in, for fields that hold an SI value: one fixed unit per
 * system (an input cannot switch between ft³ and yd³ as its number grows), bulk volume in
 * cubic yards, distance in miles, weight in pounds.
 */
export function inputUnit(unit: DisplayUnit, system: UnitSystem): { symbol: string; fromSI: (x: number) => number; toSI: (x: number) => number } {
  if (system === "metric") return { symbol: METRIC_SYMBOL[unit], fromSI: (x) => x, toSI: (x) => x };
  switch (unit) {
    case "m":
      return { symbol: "ft", fromSI: mToFt, toSI: ftToM };
    case "km":
      return { symbol: "mi", fromSI: kmToMi, toSI: (mi) => mi / kmToMi(1) };
    case "m2":
      return { symbol: "ft²", fromSI: m2ToFt2, toSI: ft2ToM2 };
    case "km2":
      return { symbol: "mi²", fromSI: (km2) => km2 / miToKm(1) ** 2, toSI: (mi2) => mi2 * miToKm(1) ** 2 };
    case "cm":
      return { symbol: "in", fromSI: cmToIn, toSI: inToCm };
    case "m3":
      return { symbol: "yd³", fromSI: m3ToYd3, toSI: yd3ToM3 };
    case "l":
      return { symbol: "US gal", fromSI: lToUsGal, toSI: usGalToL };
    case "kg":
      return { symbol: "lb", fromSI: kgToLb, toSI: lbToKg };
  }
}
