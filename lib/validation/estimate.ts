// Input to POST /api/estimate and the estimate form. Every issue carries the path of the
// field it is about, so the handler can put a message beside each field.
import type { Polygon } from "geojson";
import { z } from "zod";
import { polygonArea, polygonProblem, polygonSpan } from "@/lib/calc/area";
import { MAX_OVERLAP_SHARE } from "@/lib/calc/cardboard";
import { formatQuantity } from "@/lib/format/quantity";
import { originSchema, radiusSchema } from "./match";
import { DEPTH, LENGTH, measureKeys, notBoth, SHEET_SIDE, siValue, STOCKING, unitOf } from "./measure";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, LAYER_DEPTH_CM, MOISTURE_PCT } from "@/lib/calc/facts";
import { isCalendarDate } from "@/lib/calc/timeline";

/** Pickups one estimate may price (a product limit, as for reserving a plan at once). */
const MAX_PLAN_ITEMS = 20;

/** A product limit, not a fact: a hectare is already a market garden, not a bed. */
export const MAX_BED_AREA_M2 = 10_000;
/**
 * How far an outline may spread (the longer side of its bounding box), a product limit: a
 * bed is worked from its edges, and the cardboard count's work grows with the spread.
 */
export const MAX_OUTLINE_SPAN_M = 500;
/** Longest side we accept; the area cap is the real limit. */
const MAX_SIDE_M = 1_000;
/** Outline detail we accept per ring; a hand-drawn bed needs a few dozen points at most. */
const MAX_RING_POSITIONS = 1_000;
const MAX_RINGS = 20;
/** All rings together; bounds the ring-against-ring checks on a public route. */
const MAX_POLYGON_POSITIONS = 2_000;

/**
 * An object that refuses keys it does not know (a typo or an unknown material would
 * otherwise be dropped without a word); the message names the key and the keys it takes.
 */
export function strictObject<S extends z.core.$ZodLooseShape>(shape: S, what: string) {
  const keys = Object.keys(shape);
  const known = keys.length > 1 ? `${keys.slice(0, -1).join(", ")} or ${keys.at(-1)}` : keys.join("");
  return z.strictObject(shape, {
    error: (iss) =>
      iss.code === "unrecognized_keys" ? `Not ${what}: ${iss.keys.map((k) => `"${k}"`).join(", ")}. Use ${known}.` : undefined,
  });
}

/** A rectangle's sides, in metres or feet. */
const SIDE_LIMITS = { above: 0, max: MAX_SIDE_M };
const LENGTH_KEYS = { si: "length_m", imperial: "length_ft" };
const WIDTH_KEYS = { si: "width_m", imperial: "width_ft" };

const position = z.tuple(
  [
    z.number().min(-180, "longitude must be between -180 and 180").max(180, "longitude must be between -180 and 180"),
    z.number().min(-90, "latitude must be between -90 and 90").max(90, "latitude must be between -90 and 90"),
  ],
  z.number(),
);

const polygonGeometry = z.object({
  type: z.literal("Polygon"),
  coordinates: z
    .array(z.array(position).min(4, "a ring needs at least 4 positions").max(MAX_RING_POSITIONS))
    .min(1, "the polygon needs an outline")
    .max(MAX_RINGS),
});

export const bedSchema = strictObject(
  {
    ...measureKeys(LENGTH_KEYS, "length", LENGTH, SIDE_LIMITS),
    ...measureKeys(WIDTH_KEYS, "width", LENGTH, SIDE_LIMITS),
    polygon: polygonGeometry.optional(),
  },
  "part of a bed's shape",
)
  .superRefine((bed, ctx) => {
    const length = siValue(bed, LENGTH_KEYS, LENGTH, SIDE_LIMITS);
    const width = siValue(bed, WIDTH_KEYS, LENGTH, SIDE_LIMITS);
    const hasSides = length !== undefined || width !== undefined;
    if (bed.polygon && hasSides) {
      ctx.addIssue({ code: "custom", path: [], message: "Give either an outline or a length and width, not both" });
      return;
    }
    if (bed.polygon) {
      // zod 4 runs this refinement even when the outline's own checks failed (an empty ring
      // list, a ring too short); those already carry their messages, and the geometry below
      // would trip over them.
      if (!polygonGeometry.safeParse(bed.polygon).success) return;
      const positions = bed.polygon.coordinates.reduce((n, ring) => n + ring.length, 0);
      if (positions > MAX_POLYGON_POSITIONS) {
        ctx.addIssue({ code: "custom", path: ["polygon", "coordinates"], message: `An outline and its holes can have at most ${MAX_POLYGON_POSITIONS.toLocaleString("en-US")} positions in all` });
        return;
      }
      const problem = polygonProblem(bed.polygon);
      if (problem) {
        ctx.addIssue({ code: "custom", path: problem.ring === null ? ["polygon"] : ["polygon", "coordinates", problem.ring], message: problem.message });
      } else if (polygonSpan(bed.polygon) > MAX_OUTLINE_SPAN_M) {
        ctx.addIssue({ code: "custom", path: ["polygon"], message: `An outline can spread at most ${MAX_OUTLINE_SPAN_M} m (${formatQuantity(MAX_OUTLINE_SPAN_M, "m", "imperial")}) from end to end` });
      } else if (polygonArea(bed.polygon) > MAX_BED_AREA_M2) {
        ctx.addIssue({ code: "custom", path: ["polygon"], message: `A bed can be at most ${MAX_BED_AREA_M2.toLocaleString("en-US")} m² (${formatQuantity(MAX_BED_AREA_M2, "m2", "imperial")})` });
      }
      return;
    }
    notBoth(bed, LENGTH_KEYS, ctx);
    notBoth(bed, WIDTH_KEYS, ctx);
    if (length === undefined) ctx.addIssue({ code: "custom", path: ["length_m"], message: "Give the bed's length" });
    if (width === undefined) ctx.addIssue({ code: "custom", path: ["width_m"], message: "Give the bed's width" });
    if (length !== undefined && width !== undefined && length * width > MAX_BED_AREA_M2) {
      const system = unitOf(bed, LENGTH_KEYS) === "imperial" || unitOf(bed, WIDTH_KEYS) === "imperial" ? "imperial" : "metric";
      ctx.addIssue({ code: "custom", path: [], message: `A bed can be at most ${formatQuantity(MAX_BED_AREA_M2, "m2", system)}` });
    }
  })
  // Out as plain GeoJSON, so callers holding a Turf or Leaflet Polygon can build the type.
  .transform((bed): { length_m: number; width_m: number } | { polygon: Polygon } =>
    bed.polygon
      ? { polygon: bed.polygon }
      : { length_m: siValue(bed, LENGTH_KEYS, LENGTH, SIDE_LIMITS)!, width_m: siValue(bed, WIDTH_KEYS, LENGTH, SIDE_LIMITS)! },
  );

/**
 * Build days we plan for, a product limit: old enough for a bed already standing, and no
 * further ahead than anyone plans a garden (a year like 9999 only makes nonsense dates).
 */
export const START_YEARS = { min: 2000, max: 2100 } as const;

/** A build day: a real calendar date, YYYY-MM-DD, in START_YEARS. */
export const startDateSchema = z
  .string({ error: "Give a date as YYYY-MM-DD" })
  .refine(isCalendarDate, { message: "Give a real date as YYYY-MM-DD", abort: true })
  .refine((s) => {
    const year = Number(s.slice(0, 4));
    return year >= START_YEARS.min && year <= START_YEARS.max;
  }, `Give a build day between ${START_YEARS.min} and ${START_YEARS.max}`);

const inRange = (what: string, unit: string, r: { min: number; max: number }) =>
  z.number().min(r.min, `${what} must be at least ${r.min} ${unit}`).max(r.max, `${what} must be at most ${r.max} ${unit}`);

const ON_OFF_OR_SETTINGS = "Use true, false or an object of settings";

const DEPTH_KEYS = { si: "depth_cm", imperial: "depth_in" };

/** A loose layer: on, off, or its depth in cm or in. Out: { depth_cm? } in SI. */
// Each transform sits outside its union: inside, zod could no longer tell which option an
// object was meant for, and would drop the field's own message for the union's.
const depthLayer = (r: { min: number; max: number }) =>
  z
    .union(
      [z.boolean(), strictObject(measureKeys(DEPTH_KEYS, "depth", DEPTH, r), "a setting of this layer").superRefine((l, ctx) => notBoth(l, DEPTH_KEYS, ctx))],
      { error: ON_OFF_OR_SETTINGS },
    )
    .transform((l): boolean | { depth_cm?: number } => {
      if (typeof l === "boolean") return l;
      const depth_cm = siValue(l, DEPTH_KEYS, DEPTH, r);
      return depth_cm === undefined ? {} : { depth_cm };
    });

// Sheets shorter than this could not overlap a 30 cm seam and still cover anything.
const SHEET_LIMITS = { min: 0.35, max: 5 };
const OVERLAP_KEYS = { si: "overlap_cm", imperial: "overlap_in" };
const SHEET_LENGTH_KEYS = { si: "sheet_length_m", imperial: "sheet_length_in" };
const SHEET_WIDTH_KEYS = { si: "sheet_width_m", imperial: "sheet_width_in" };

const cardboardSettings = strictObject(
  {
    ...measureKeys(OVERLAP_KEYS, "overlap", DEPTH, CARDBOARD_OVERLAP_CM),
    ...measureKeys(SHEET_LENGTH_KEYS, "a sheet side", SHEET_SIDE, SHEET_LIMITS),
    ...measureKeys(SHEET_WIDTH_KEYS, "a sheet side", SHEET_SIDE, SHEET_LIMITS),
  },
  "a cardboard setting",
)
  .superRefine((c, ctx) => {
    for (const keys of [OVERLAP_KEYS, SHEET_LENGTH_KEYS, SHEET_WIDTH_KEYS]) notBoth(c, keys, ctx);
    // Wider seams bury most of each sheet, and tiny sheets with wide seams make a grid of
    // millions: refused (lib/calc/cardboard.ts MAX_OVERLAP_SHARE).
    const sl = siValue(c, SHEET_LENGTH_KEYS, SHEET_SIDE, SHEET_LIMITS) ?? DEFAULT_CARDBOARD_SHEET.length_m;
    const sw = siValue(c, SHEET_WIDTH_KEYS, SHEET_SIDE, SHEET_LIMITS) ?? DEFAULT_CARDBOARD_SHEET.width_m;
    const most_cm = MAX_OVERLAP_SHARE * Math.min(sl, sw) * 100;
    const overlap = siValue(c, OVERLAP_KEYS, DEPTH, CARDBOARD_OVERLAP_CM) ?? CARDBOARD_OVERLAP_CM.default;
    if (overlap > most_cm + 1e-9) {
      const imperial = unitOf(c, OVERLAP_KEYS) === "imperial";
      ctx.addIssue({
        code: "custom",
        path: [imperial ? OVERLAP_KEYS.imperial : OVERLAP_KEYS.si],
        message: `overlap must be at most half the sheet's shorter side, ${imperial ? `${(Math.floor(DEPTH.fromSi(most_cm) * 10) / 10).toString()} in` : `${Number(most_cm.toFixed(1))} cm`}`,
      });
    }
  });

function cardboardToSi(c: Record<string, number | undefined>) {
  const out: { overlap_cm?: number; sheet_length_m?: number; sheet_width_m?: number } = {};
  const overlap_cm = siValue(c, OVERLAP_KEYS, DEPTH, CARDBOARD_OVERLAP_CM);
  const sheet_length_m = siValue(c, SHEET_LENGTH_KEYS, SHEET_SIDE, SHEET_LIMITS);
  const sheet_width_m = siValue(c, SHEET_WIDTH_KEYS, SHEET_SIDE, SHEET_LIMITS);
  if (overlap_cm !== undefined) out.overlap_cm = overlap_cm;
  if (sheet_length_m !== undefined) out.sheet_length_m = sheet_length_m;
  if (sheet_width_m !== undefined) out.sheet_width_m = sheet_width_m;
  return out;
}

// Bins run at a few kg/m²; past 5 a bed is a worm farm, so treat it as a typo.
const STOCKING_LIMITS = { above: 0, max: 5 };
const STOCKING_KEYS = { si: "kg_per_m2", imperial: "oz_per_ft2" };
const wormSettings = strictObject(measureKeys(STOCKING_KEYS, "stocking", STOCKING, STOCKING_LIMITS), "a worm setting").superRefine((w, ctx) =>
  notBoth(w, STOCKING_KEYS, ctx),
);
function wormsToSi(w: Record<string, number | undefined>): { kg_per_m2?: number } {
  const kg_per_m2 = siValue(w, STOCKING_KEYS, STOCKING, STOCKING_LIMITS);
  return kg_per_m2 === undefined ? {} : { kg_per_m2 };
}

/**
 * Every measurement may come in metric or imperial units (depth_cm or depth_in, overlap_cm
 * or overlap_in, sheet_length_m or sheet_length_in, kg_per_m2 or oz_per_ft2) and is checked,
 * and its messages written, in the unit it came in; what comes out is SI.
 */
export const layersSchema = strictObject({
  cardboard: z
    .union([z.boolean(), cardboardSettings], { error: ON_OFF_OR_SETTINGS })
    .transform((c) => (typeof c === "boolean" ? c : cardboardToSi(c)))
    .optional(),
  leaves: depthLayer(LAYER_DEPTH_CM.leaves).optional(),
  straw: depthLayer(LAYER_DEPTH_CM.straw).optional(),
  wood_chips: depthLayer(LAYER_DEPTH_CM.wood_chips).optional(),
  worms: z
    .union([z.boolean(), wormSettings], { error: ON_OFF_OR_SETTINGS })
    .transform((w) => (typeof w === "boolean" ? w : wormsToSi(w)))
    .optional(),
}, "a layer");

/**
 * A layer left out of `layers` (or `layers` itself left out) takes its default: cardboard,
 * leaves, straw and worms on, wood chips off. `true` means on with the default settings.
 * When the bed is an outline and no latitude is given, the outline's centre gives it.
 */
export const estimateSchema = strictObject({
  bed: bedSchema,
  layers: layersSchema.optional(),
  start_date: startDateSchema.optional(),
  latitude: z.number().min(-90, "latitude must be between -90 and 90").max(90, "latitude must be between -90 and 90").optional(),
  target_moisture_pct: inRange("target moisture", "%", MOISTURE_PCT).optional(),
  /** The units the advice and timeline are written in; figures are always SI. */
  units: z.enum(["metric", "imperial"], { error: "units must be metric or imperial" }).optional(),
  /** Price the bed with these pickups (a plan from POST /api/match, or listings chosen by hand). */
  plan: strictObject(
    {
      items: z
        .array(
          strictObject(
            {
              listing_id: z.string({ error: "listing_id must be a string" }).trim().min(1, "listing_id must not be empty").max(64, "listing_id is too long"),
              quantity: z.number({ error: "quantity must be a number" }).positive("quantity must be more than 0").max(100_000, "quantity must be at most 100,000"),
            },
            "part of a pickup",
          ),
          { error: "items must be a list" },
        )
        .min(1, "Give at least one pickup")
        .max(MAX_PLAN_ITEMS, `Give at most ${MAX_PLAN_ITEMS} pickups`),
    },
    "part of a plan",
  ).optional(),
  /** Or let Duffbank match the bed's needs to nearby listings and price that plan. */
  match: strictObject(
    {
      origin: originSchema.optional(),
      radius_km: radiusSchema,
    },
    "part of a match",
  ).optional(),
}, "part of an estimate request").superRefine((e, ctx) => {
  if (e.plan && e.match) ctx.addIssue({ code: "custom", path: ["match"], message: "Give a plan or a match, not both" });
  if (e.match && !e.match.origin && !("polygon" in e.bed)) ctx.addIssue({ code: "custom", path: ["match", "origin"], message: "Give the origin as {lat, lng}: a rectangle has no place of its own" });
});

export type EstimateInput = z.infer<typeof estimateSchema>;
export type EstimateRequest = z.input<typeof estimateSchema>;
export type EstimateLayers = z.infer<typeof layersSchema>;
