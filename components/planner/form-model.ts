import type { FieldErrors, Resolver } from "react-hook-form";
import { estimateSchema, type EstimateRequest } from "@/lib/validation/estimate";
import { cmToIn, ftToM, inToCm, mToFt, type UnitSystem } from "@/lib/calc/units";
import { CARDBOARD_OVERLAP_CM, LAYER_DEPTH_CM } from "@/lib/calc/facts";
import type { LatLng } from "@/components/map/types";

/** What the planner form holds: sizes in the gardener's own units, layers as switches. */
export interface PlanValues {
  /** The units the numbers below are in. */
  system: UnitSystem;
  shape: "rectangle" | "outline";
  length: string;
  width: string;
  outline: LatLng[];
  location: LatLng | null;
  cardboard_on: boolean;
  overlap: string;
  leaves_on: boolean;
  leaves_depth: string;
  straw_on: boolean;
  straw_depth: string;
  worms_on: boolean;
  start_date: string;
}

const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s.replace(",", ".")));
const fix = (x: number, d = 1) => String(Math.round(x * 10 ** d) / 10 ** d);

export function defaultPlanValues(system: UnitSystem, today: string): PlanValues {
  const len = (m: number) => (system === "metric" ? fix(m, 2) : fix(mToFt(m), 1));
  const depth = (cm: number) => (system === "metric" ? fix(cm, 1) : fix(cmToIn(cm), 1));
  return {
    system,
    shape: "rectangle",
    length: len(3),
    width: len(1.2),
    outline: [],
    location: null,
    cardboard_on: true,
    overlap: depth(CARDBOARD_OVERLAP_CM.default),
    leaves_on: true,
    leaves_depth: depth(LAYER_DEPTH_CM.leaves.default),
    straw_on: true,
    straw_depth: depth(LAYER_DEPTH_CM.straw.default),
    worms_on: true,
    start_date: today,
  };
}

/** Re-express the form's numbers when the gardener flips metric/imperial. */
export function convertValues(v: PlanValues, from: UnitSystem, to: UnitSystem): PlanValues {
  if (from === to) return v;
  const len = (s: string) => (Number.isNaN(num(s)) ? s : to === "imperial" ? fix(mToFt(num(s)), 2) : fix(ftToM(num(s)), 2));
  const depth = (s: string) => (Number.isNaN(num(s)) ? s : to === "imperial" ? fix(cmToIn(num(s)), 1) : fix(inToCm(num(s)), 1));
  return { ...v, system: to, length: len(v.length), width: len(v.width), overlap: depth(v.overlap), leaves_depth: depth(v.leaves_depth), straw_depth: depth(v.straw_depth) };
}

/** The request POST /api/estimate takes, in SI, built from the form. */
export function toRequest(v: PlanValues): EstimateRequest {
  const system = v.system;
  const m = (s: string) => (system === "metric" ? num(s) : ftToM(num(s)));
  const cm = (s: string) => (system === "metric" ? num(s) : inToCm(num(s)));
  const ring = v.outline.map((p) => [p.lng, p.lat] as [number, number]);
  const bed =
    v.shape === "outline"
      ? { polygon: { type: "Polygon" as const, coordinates: [ring.length ? [...ring, ring[0]] : []] } }
      : { length_m: m(v.length), width_m: m(v.width) };
  return {
    bed: bed as EstimateRequest["bed"],
    layers: {
      cardboard: v.cardboard_on ? { overlap_cm: cm(v.overlap) } : false,
      leaves: v.leaves_on ? { depth_cm: cm(v.leaves_depth) } : false,
      straw: v.straw_on ? { depth_cm: cm(v.straw_depth) } : false,
      worms: v.worms_on,
    },
    ...(v.start_date ? { start_date: v.start_date } : {}),
    ...(v.shape === "rectangle" && v.location ? { latitude: v.location.lat } : {}),
  };
}

// Where each schema path shows its message in the form.
const FIELD_FOR: [RegExp, keyof PlanValues][] = [
  [/^bed\.length_m/, "length"],
  [/^bed\.width_m/, "width"],
  [/^bed\.polygon/, "outline"],
  [/^bed$/, "length"],
  [/^layers\.cardboard/, "overlap"],
  [/^layers\.leaves/, "leaves_depth"],
  [/^layers\.straw/, "straw_depth"],
  [/^start_date/, "start_date"],
];

/**
 * The form is checked by the same schema as the route handler: the values are turned
 * into the request and parsed, and each issue is shown beside its field.
 */
export function planResolver(): Resolver<PlanValues> {
  return async (values) => {
    if (values.shape === "outline" && values.outline.length < 3) {
      return { values: {}, errors: { outline: { type: "custom", message: "Click at least three corners of the bed on the map." } } as FieldErrors<PlanValues> };
    }
    const parsed = estimateSchema.safeParse(toRequest(values));
    if (parsed.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join(".");
      const field = FIELD_FOR.find(([re]) => re.test(path))?.[1];
      const message = /expected number|NaN/i.test(issue.message) ? "Enter a number." : issue.message;
      if (field && !errors[field]) errors[field] = { type: "custom", message };
    }
    if (Object.keys(errors).length === 0) errors.length = { type: "custom", message: parsed.error.issues[0]?.message ?? "Check the bed's size." };
    return { values: {}, errors: errors as FieldErrors<PlanValues> };
  };
}

/** A saved bed as planner values, for editing it. */
export function valuesFromBed(
  bed: { shape: { length_m: number; width_m: number } | { polygon: { coordinates: number[][][] } }; layers: Record<string, unknown>; start_date: string | null; location: LatLng | null },
  system: UnitSystem,
  today: string,
): PlanValues {
  const base = defaultPlanValues("metric", today);
  const layer = (key: string) => bed.layers[key];
  const on = (key: string, byDefault = true) => (layer(key) === undefined ? byDefault : layer(key) !== false);
  const setting = (key: string, field: string, fallback: string) => {
    const v = layer(key);
    return v && typeof v === "object" && field in v ? String((v as Record<string, number>)[field]) : fallback;
  };
  const metric: PlanValues = {
    ...base,
    shape: "polygon" in bed.shape ? "outline" : "rectangle",
    length: "length_m" in bed.shape ? String(bed.shape.length_m) : base.length,
    width: "width_m" in bed.shape ? String(bed.shape.width_m) : base.width,
    outline: "polygon" in bed.shape ? bed.shape.polygon.coordinates[0].slice(0, -1).map(([lng, lat]) => ({ lat, lng })) : [],
    location: bed.location,
    cardboard_on: on("cardboard"),
    overlap: setting("cardboard", "overlap_cm", base.overlap),
    leaves_on: on("leaves"),
    leaves_depth: setting("leaves", "depth_cm", base.leaves_depth),
    straw_on: on("straw"),
    straw_depth: setting("straw", "depth_cm", base.straw_depth),
    worms_on: on("worms"),
    start_date: bed.start_date ?? "",
  };
  return convertValues(metric, "metric", system);
}
