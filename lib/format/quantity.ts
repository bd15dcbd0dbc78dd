// Quantities as a person reads and acts on them: converted to their unit system (through
// lib/calc/units, the one conversion module) and rounded to what they can measure out. The
// figures behind them rest on densities that vary twofold, so more digits would promise an
// accuracy the facts do not have: worms "about 11,000", not 11,023; "0.9 km", not 0.888;
// water to 5 or 10 litres.
import { lToUsGal, toDisplay, type DisplayUnit, type UnitSystem } from "@/lib/calc/units";
import { formatNumber as EN } from "./number";

/** `value` rounded to the nearest multiple of `step` (steps like 0.5 or 5 keep their decimals clean). */
export function roundToStep(value: number, step: number): number {
  return Number((Math.round(value / step) * step).toFixed(6));
}

function significant(value: number, figures: number): { value: number; decimals: number } {
  if (value === 0 || !Number.isFinite(value)) return { value, decimals: 0 };
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = figures - 1 - magnitude;
  const f = 10 ** decimals;
  return { value: Number((Math.round(value * f) / f).toFixed(Math.max(0, decimals))), decimals };
}

/** Litres to pour: whole litres under 10, then 5 L, then 10 L. A little is never nothing. */
export function roundLitres(l: number): number {
  if (!(l > 0)) return 0;
  const step = l < 10 ? 1 : l < 100 ? 5 : 10;
  return Math.max(step, roundToStep(l, step));
}

/** US gallons likewise: half gallons under 3, then whole gallons, then 5 gal. */
export function roundUsGallons(gal: number): number {
  if (!(gal > 0)) return 0;
  const step = gal < 3 ? 0.5 : gal < 30 ? 1 : 5;
  return Math.max(step, roundToStep(gal, step));
}

/** A count nobody counts one by one (worms): two significant figures past a hundred. */
export function roundCount(n: number): number {
  if (!(n > 0)) return 0;
  return n < 100 ? Math.round(n) : significant(n, 2).value;
}

/** "about 11,000". */
export function formatCount(n: number): string {
  return `about ${EN(roundCount(n), 0)}`;
}

/** A shown value (already in the reader's unit) rounded for its symbol, with the decimals to print. */
function rounded(value: number, symbol: string): { value: number; decimals: number } {
  const a = Math.abs(value);
  switch (symbol) {
    case "km":
    case "mi":
      // Tenths while a trip is short, whole units past ten.
      if (a >= 10) return { value: Math.round(value), decimals: 0 };
      if (a >= 0.1) return { value: roundToStep(value, 0.1), decimals: 1 };
      return significant(value, 1);
    case "L":
      return { value: Math.sign(value) * roundLitres(a), decimals: 0 };
    case "US gal":
      return { value: Math.sign(value) * roundUsGallons(a), decimals: 1 };
    case "kg":
    case "lb":
      if (a < 1) return significant(value, 2);
      if (a < 10) return { value: roundToStep(value, 0.1), decimals: 1 };
      if (a < 1000) return { value: Math.round(value), decimals: 0 };
      return significant(value, 3);
    case "cm":
      return a < 100 ? { value: roundToStep(value, 0.1), decimals: 1 } : { value: Math.round(value), decimals: 0 };
    case "in":
      return a < 10 ? { value: roundToStep(value, 0.1), decimals: 1 } : { value: Math.round(value), decimals: 0 };
    case "m³": {
      // Cubic metres to the hundredth at most (a gardener measures out no finer); a volume
      // smaller than that keeps one figure, so a little is never nothing.
      const s = significant(value, 3);
      if (s.decimals <= 2) return s;
      return a >= 0.01 ? { value: roundToStep(value, 0.01), decimals: 2 } : significant(value, 1);
    }
    default:
      // Lengths, areas and volumes: three figures, as precise as any density behind them.
      return significant(value, 3);
  }
}

/** An SI value in the reader's unit, rounded to what they can act on: "0.9 km", "95 L", "4.9 in". */
export function formatQuantity(value: number, unit: DisplayUnit, system: UnitSystem): string {
  const shown = toDisplay(value, unit, system);
  const r = rounded(shown.value, shown.symbol);
  return `${EN(r.value, r.decimals)} ${shown.symbol}`;
}

/**
 * How far away a place is: "about 400 m" under a kilometre (to the hundred metres, never
 * less than 100 m), else "about 3.2 km" or "about 12 mi", rounded as formatQuantity rounds a trip.
 */
export function formatDistance(km: number, system: UnitSystem = "metric"): string {
  if (system === "metric" && km < 1) return `about ${Math.max(100, Math.round(km * 10) * 100)} m`;
  return `about ${formatQuantity(km, "km", system)}`;
}

/** A span in the reader's unit, "60–130 L" or "16–34 US gal"; one figure when both ends round alike. */
export function formatRange(low: number, high: number, unit: DisplayUnit, system: UnitSystem): string {
  const lo = toDisplay(low, unit, system);
  const hi = toDisplay(high, unit, system);
  if (lo.symbol !== hi.symbol) return `${formatQuantity(low, unit, system)}–${formatQuantity(high, unit, system)}`;
  const a = rounded(lo.value, lo.symbol);
  const b = rounded(hi.value, hi.symbol);
  if (a.value === b.value) return `${EN(a.value, a.decimals)} ${hi.symbol}`;
  return `${EN(a.value, a.decimals)}–${EN(b.value, b.decimals)} ${hi.symbol}`;
}

/** Litres as US gallons, rounded the way water is poured. */
export const litresAsUsGallons = (l: number) => roundUsGallons(lToUsGal(l));

/** How far a public point is moved from the real one, in words the reader measures in. */
export const fewHundred = (system: UnitSystem) => (system === "imperial" ? "a few hundred yards" : "a few hundred metres");
