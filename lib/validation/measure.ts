// A measurement a request may give in metric or in imperial units: `depth_cm` or
// `depth_in`, `length_m` or `length_ft`. Each is checked in the unit it came in, so a
// gardener who typed 13 in hears "at most 12 in", not "at most 30 cm"; the limits in the
// imperial unit are the metric ones converted and rounded the way they are shown, and a
// value inside them is stored in SI, kept within the metric limits (12 in is 30 cm, not
// 30.48: the difference is below what "12 in" says).
import { z } from "zod";
import { formatNumber } from "@/lib/format/number";
import { cmToIn, ftToM, inToCm, kgToLb, lbToKg, m2ToFt2, mToFt } from "@/lib/calc/units";

export interface Dimension {
  si: { suffix: string; symbol: string };
  imperial: { suffix: string; symbol: string };
  toSi: (x: number) => number;
  fromSi: (x: number) => number;
  /** A limit in the imperial unit, rounded the way a person says it. */
  nice: (x: number) => number;
  /** The SI limit as forms also show it, when they use another metric unit ("35 cm"). */
  siAlso?: (x: number) => string;
}

const oneDecimalUnderTen = (x: number) => (Math.abs(x) < 10 ? Math.round(x * 10) / 10 : Math.round(x));
const threeFigures = (x: number) => (x === 0 ? 0 : Number(x.toPrecision(3)));

export const LENGTH: Dimension = { si: { suffix: "m", symbol: "m" }, imperial: { suffix: "ft", symbol: "ft" }, toSi: ftToM, fromSi: mToFt, nice: threeFigures };
export const DEPTH: Dimension = { si: { suffix: "cm", symbol: "cm" }, imperial: { suffix: "in", symbol: "in" }, toSi: inToCm, fromSi: cmToIn, nice: oneDecimalUnderTen };
/** A cardboard sheet's side: metres in SI, inches in imperial (sheets are measured with a tape). */
export const SHEET_SIDE: Dimension = {
  si: { suffix: "m", symbol: "m" },
  imperial: { suffix: "in", symbol: "in" },
  toSi: (inches) => inToCm(inches) / 100,
  fromSi: (m) => cmToIn(m * 100),
  nice: oneDecimalUnderTen,
  // The planner asks for sheet sides in cm.
  siAlso: (m) => `${Number((m * 100).toPrecision(6))} cm`,
};
// 16 oz to the pound (exact); pound and foot from NIST (lib/calc/facts.ts).
const kgM2ToOzFt2 = (x: number) => (kgToLb(x) * 16) / m2ToFt2(1);
const ozFt2ToKgM2 = (x: number) => lbToKg(x / 16) * m2ToFt2(1);
export const STOCKING: Dimension = {
  si: { suffix: "kg_per_m2", symbol: "kg/m²" },
  imperial: { suffix: "oz_per_ft2", symbol: "oz/ft²" },
  toSi: ozFt2ToKgM2,
  fromSi: kgM2ToOzFt2,
  nice: (x) => Math.round(x * 10) / 10,
};

export interface Limits {
  min?: number;
  /** Strictly more than this (a size, not a setting). */
  above?: number;
  max: number;
}

const n = (x: number) => formatNumber(x, 2);

/** One field's schema in one unit, with messages in that unit. */
function field(what: string, symbol: string, limits: Limits, also?: (x: number) => string) {
  const say = (x: number) => `${n(x)} ${symbol}${also ? ` (${also(x)})` : ""}`;
  let s = z.number({ error: `${what} must be a number of ${symbol}` });
  if (limits.above !== undefined) s = s.gt(limits.above, `${what} must be more than ${say(limits.above)}`);
  if (limits.min !== undefined) s = s.min(limits.min, `${what} must be at least ${say(limits.min)}`);
  return s.max(limits.max, `${what} must be at most ${say(limits.max)}`);
}

/** The limits of a metric range, in the imperial unit as a person would say them. */
export function imperialLimits(d: Dimension, limits: Limits): Limits {
  const conv = (x: number | undefined) => (x === undefined ? undefined : d.nice(d.fromSi(x)));
  return { min: conv(limits.min), above: limits.above, max: conv(limits.max)! };
}

/** The two keys a measurement may come in, e.g. { si: "depth_cm", imperial: "depth_in" }. */
export interface MeasureKeys {
  si: string;
  imperial: string;
}

/** The pair of optional keys for a measurement, each checked in its own unit. */
export function measureKeys(keys: MeasureKeys, what: string, d: Dimension, limits: Limits) {
  return {
    [keys.si]: field(what, d.si.symbol, limits, d.siAlso).optional(),
    [keys.imperial]: field(what, d.imperial.symbol, imperialLimits(d, limits)).optional(),
  } as Record<string, z.ZodOptional<z.ZodNumber>>;
}

/** Flags a measurement given both ways. */
export function notBoth(obj: Record<string, unknown>, keys: MeasureKeys, ctx: z.RefinementCtx, path: (string | number)[] = []): void {
  if (obj[keys.si] !== undefined && obj[keys.imperial] !== undefined) {
    ctx.addIssue({ code: "custom", path: [...path, keys.imperial], message: `Give ${keys.si} or ${keys.imperial}, not both` });
  }
}

/**
 * The SI value of a measurement given either way (undefined when neither is given). An
 * imperial value is kept within the metric limits.
 */
export function siValue(obj: Record<string, unknown>, keys: MeasureKeys, d: Dimension, limits: Limits): number | undefined {
  const si = obj[keys.si] as number | undefined;
  const imp = obj[keys.imperial] as number | undefined;
  if (si !== undefined || imp === undefined) return si;
  return Math.min(limits.max, Math.max(limits.min ?? -Infinity, d.toSi(imp)));
}

/** Which unit a measurement came in, for messages about it that are not about its own range. */
export function unitOf(obj: Record<string, unknown>, keys: MeasureKeys): "metric" | "imperial" {
  return obj[keys.imperial] !== undefined ? "imperial" : "metric";
}
