import type { FieldErrors, Resolver } from "react-hook-form";
import { estimateSchema, type EstimateRequest } from "@/lib/validation/estimate";
import { cmToIn, ftToM, inToCm, kgToLb, lbToKg, m2ToFt2, mToFt, type UnitSystem } from "@/lib/calc/units";
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
  chips_on: boolean;
  chips_depth: string;
  /** Cardboard sheet sides in cm or in; blank for the usual sheet. */
  sheet_length: string;
  sheet_width: string;
  worms_on: boolean;
  /** Worms to stock in kg/m² or oz/ft²; blank for the usual stocking. */
  worms_stocking: string;
  start_date: string;
  /**
   * The exact SI value behind each number and how it was shown: a number left as shown is
   * sent back exactly, so switching units back and forth, or editing a saved bed, never
   * nudges a setting through rounding for display.
   */
  exact?: Partial<Record<NumericField, { shown: string; si: number }>>;
}

/** The form's number fields and what each measures. */
const NUMERIC = {
  length: "len",
  width: "len",
  overlap: "depth",
  sheet_length: "sheet",
  sheet_width: "sheet",
  leaves_depth: "depth",
  straw_depth: "depth",
  chips_depth: "depth",
  worms_stocking: "stocking",
} as const;
type NumericField = keyof typeof NUMERIC;
type Measure = (typeof NUMERIC)[NumericField];
const NUMERIC_FIELDS = Object.keys(NUMERIC) as NumericField[];

const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s.replace(",", ".")));
const fix = (x: number, d = 1) => String(Math.round(x * 10 ** d) / 10 ** d);

// kg/m² ↔ oz/ft²: 16 oz to the lb (exact), the pound and foot from NIST in facts.ts.
const kgM2ToOzFt2 = (x: number) => (kgToLb(x) * 16) / m2ToFt2(1);
const ozFt2ToKgM2 = (x: number) => (lbToKg(x / 16) * m2ToFt2(1));

// Sheet sides are sent in metres but shown in cm or in, like a depth; toPrecision drops the
// float noise of × 100 (1.1 m is 110.00000000000001 cm).
const mToCm = (m: number) => Number((m * 100).toPrecision(12));

/** A value as the request carries it (m, cm or kg/m²) as the form shows it in `system`. */
function show(measure: Measure, si: number, system: UnitSystem): string {
  if (measure === "sheet") return system === "metric" ? String(mToCm(si)) : fix(cmToIn(si * 100), 1);
  if (system === "metric") return String(si);
  if (measure === "len") return fix(mToFt(si), 2);
  if (measure === "depth") return fix(cmToIn(si), 1);
  return fix(kgM2ToOzFt2(si), 2);
}

/** A number typed in `system` as the request carries it (m, cm or kg/m²). */
function toSi(measure: Measure, n: number, system: UnitSystem): number {
  if (measure === "sheet") return (system === "metric" ? n : inToCm(n)) / 100;
  if (system === "metric") return n;
  if (measure === "len") return ftToM(n);
  if (measure === "depth") return inToCm(n);
  return ozFt2ToKgM2(n);
}

/** The exact SI value behind a field while it is left as shown. */
function keptSi(v: PlanValues, field: NumericField): number | undefined {
  const kept = v.exact?.[field];
  return kept && kept.shown === v[field] ? kept.si : undefined;
}

/** The SI value of a number field: the exact value while it is left as shown, else what is typed. */
function siOf(v: PlanValues, field: NumericField): number {
  return keptSi(v, field) ?? toSi(NUMERIC[field], num(v[field]), v.system);
}

/** Fields shown from exact SI values, each remembered with how it was shown. */
function shownFrom(values: Partial<Record<NumericField, number>>, system: UnitSystem) {
  const fields: Partial<Record<NumericField, string>> = {};
  const exact: NonNullable<PlanValues["exact"]> = {};
  for (const [field, si] of Object.entries(values) as [NumericField, number][]) {
    fields[field] = show(NUMERIC[field], si, system);
    exact[field] = { shown: fields[field]!, si };
  }
  return { fields, exact };
}

// A bed someone starts in imperial is a round one in their units (10 × 4 ft, 5 in of leaves),
// not the metric bed converted (9.84 × 3.94 ft); switching units later converts what is there.
const feet = (m: number, system: UnitSystem) => (system === "metric" ? m : Number(ftToM(Math.round(mToFt(m))).toPrecision(12)));
const inches = (cm: number, system: UnitSystem) => (system === "metric" ? cm : Number(inToCm(Math.max(1, Math.round(cmToIn(cm)))).toPrecision(12)));

export function defaultPlanValues(system: UnitSystem, today: string): PlanValues {
  const { fields, exact } = shownFrom(
    {
      length: feet(3, system),
      width: feet(1.2, system),
      overlap: inches(CARDBOARD_OVERLAP_CM.default, system),
      leaves_depth: inches(LAYER_DEPTH_CM.leaves.default, system),
      straw_depth: inches(LAYER_DEPTH_CM.straw.default, system),
      chips_depth: inches(LAYER_DEPTH_CM.wood_chips.default, system),
    },
    system,
  );
  return {
    system,
    shape: "rectangle",
    length: fields.length!,
    width: fields.width!,
    outline: [],
    location: null,
    cardboard_on: true,
    overlap: fields.overlap!,
    leaves_on: true,
    leaves_depth: fields.leaves_depth!,
    straw_on: true,
    straw_depth: fields.straw_depth!,
    chips_on: false,
    chips_depth: fields.chips_depth!,
    sheet_length: "",
    sheet_width: "",
    worms_on: true,
    worms_stocking: "",
    start_date: today,
    exact,
  };
}

/**
 * Re-express the form's numbers when the gardener flips metric/imperial. Each number's exact
 * SI value goes with it, so flipping back shows what was there before (12.5 cm, not 12.4).
 */
export function convertValues(v: PlanValues, from: UnitSystem, to: UnitSystem): PlanValues {
  if (from === to) return v;
  const out: PlanValues = { ...v, system: to };
  const exact: NonNullable<PlanValues["exact"]> = {};
  for (const field of NUMERIC_FIELDS) {
    const typed = num(v[field]);
    const si = keptSi(v, field) ?? (Number.isNaN(typed) ? undefined : toSi(NUMERIC[field], typed, from));
    if (si === undefined) continue; // blank or not a number: left as typed
    out[field] = show(NUMERIC[field], si, to);
    exact[field] = { shown: out[field], si };
  }
  out.exact = exact;
  return out;
}

/** The request keys of each number field, in SI and in imperial units. */
const KEYS: Record<NumericField, { si: string; imperial: string }> = {
  length: { si: "length_m", imperial: "length_ft" },
  width: { si: "width_m", imperial: "width_ft" },
  overlap: { si: "overlap_cm", imperial: "overlap_in" },
  sheet_length: { si: "sheet_length_m", imperial: "sheet_length_in" },
  sheet_width: { si: "sheet_width_m", imperial: "sheet_width_in" },
  leaves_depth: { si: "depth_cm", imperial: "depth_in" },
  straw_depth: { si: "depth_cm", imperial: "depth_in" },
  chips_depth: { si: "depth_cm", imperial: "depth_in" },
  worms_stocking: { si: "kg_per_m2", imperial: "oz_per_ft2" },
};

/**
 * A number field as the request carries it: its exact SI value while left as shown; else
 * what was typed, in the unit it was typed in (so a message about it comes back in that
 * unit). Blank optional fields are left out.
 */
function entry(v: PlanValues, field: NumericField, optional = false): Record<string, number> {
  if (optional && v[field].trim() === "") return {};
  const kept = keptSi(v, field);
  if (kept !== undefined) return { [KEYS[field].si]: kept };
  const typed = num(v[field]);
  if (v.system === "imperial") return { [KEYS[field].imperial]: typed };
  // The metric form shows sheet sides in cm; the request takes metres.
  return { [KEYS[field].si]: NUMERIC[field] === "sheet" ? typed / 100 : typed };
}

/** The request POST /api/estimate takes, built from the form. */
export function toRequest(v: PlanValues): EstimateRequest {
  const ring = v.outline.map((p) => [p.lng, p.lat] as [number, number]);
  const bed =
    v.shape === "outline"
      ? { polygon: { type: "Polygon" as const, coordinates: [ring.length ? [...ring, ring[0]] : []] } }
      : { ...entry(v, "length"), ...entry(v, "width") };
  const stocking = entry(v, "worms_stocking", true);
  return {
    bed: bed as EstimateRequest["bed"],
    layers: {
      cardboard: v.cardboard_on ? { ...entry(v, "overlap"), ...entry(v, "sheet_length", true), ...entry(v, "sheet_width", true) } : false,
      leaves: v.leaves_on ? entry(v, "leaves_depth") : false,
      straw: v.straw_on ? entry(v, "straw_depth") : false,
      wood_chips: v.chips_on ? entry(v, "chips_depth") : false,
      worms: v.worms_on ? (Object.keys(stocking).length === 0 ? true : stocking) : false,
    },
    ...(v.start_date ? { start_date: v.start_date } : {}),
    ...(v.shape === "rectangle" && v.location ? { latitude: v.location.lat } : {}),
    units: v.system,
  } as EstimateRequest;
}

// Where each schema path shows its message in the form.
const FIELD_FOR: [RegExp, keyof PlanValues][] = [
  [/^bed\.length_/, "length"],
  [/^bed\.width_/, "width"],
  [/^bed\.polygon/, "outline"],
  [/^bed$/, "length"],
  [/^layers\.cardboard\.sheet_length_/, "sheet_length"],
  [/^layers\.cardboard\.sheet_width_/, "sheet_width"],
  [/^layers\.cardboard/, "overlap"],
  [/^layers\.leaves/, "leaves_depth"],
  [/^layers\.straw/, "straw_depth"],
  [/^layers\.wood_chips/, "chips_depth"],
  [/^layers\.worms/, "worms_stocking"],
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
  const exact: NonNullable<PlanValues["exact"]> = { ...base.exact };
  const keep = (field: NumericField, si: unknown) => {
    if (typeof si === "number" && Number.isFinite(si)) exact[field] = { shown: show(NUMERIC[field], si, "metric"), si };
  };
  const setting = (key: string, name: string) => {
    const v = layer(key);
    return v && typeof v === "object" ? (v as Record<string, unknown>)[name] : undefined;
  };
  if ("length_m" in bed.shape) {
    keep("length", bed.shape.length_m);
    keep("width", bed.shape.width_m);
  }
  keep("overlap", setting("cardboard", "overlap_cm"));
  keep("sheet_length", setting("cardboard", "sheet_length_m"));
  keep("sheet_width", setting("cardboard", "sheet_width_m"));
  keep("leaves_depth", setting("leaves", "depth_cm"));
  keep("straw_depth", setting("straw", "depth_cm"));
  keep("chips_depth", setting("wood_chips", "depth_cm"));
  keep("worms_stocking", setting("worms", "kg_per_m2"));
  const shown = (field: NumericField) => exact[field]?.shown ?? base[field];
  const metric: PlanValues = {
    ...base,
    shape: "polygon" in bed.shape ? "outline" : "rectangle",
    length: shown("length"),
    width: shown("width"),
    outline: "polygon" in bed.shape ? bed.shape.polygon.coordinates[0].slice(0, -1).map(([lng, lat]) => ({ lat, lng })) : [],
    location: bed.location,
    cardboard_on: on("cardboard"),
    overlap: shown("overlap"),
    sheet_length: shown("sheet_length"),
    sheet_width: shown("sheet_width"),
    leaves_on: on("leaves"),
    leaves_depth: shown("leaves_depth"),
    straw_on: on("straw"),
    straw_depth: shown("straw_depth"),
    chips_on: on("wood_chips", false),
    chips_depth: shown("chips_depth"),
    worms_on: on("worms"),
    worms_stocking: shown("worms_stocking"),
    start_date: bed.start_date ?? "",
    exact,
  };
  return convertValues(metric, "metric", system);
}
