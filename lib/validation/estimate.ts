// Input to POST /api/estimate and the estimate form. Every issue carries the path of the
// field it is about, so the handler can put a message beside each field.
import type { Polygon } from "geojson";
import { z } from "zod";
import { polygonArea, polygonProblem, polygonSpan } from "@/lib/calc/area";
import { MAX_OVERLAP_SHARE } from "@/lib/calc/cardboard";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, LAYER_DEPTH_CM, MOISTURE_PCT } from "@/lib/calc/facts";
import { isCalendarDate } from "@/lib/calc/timeline";

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

const side = (label: string) =>
  z
    .number({ error: `${label} must be a number of metres` })
    .positive(`${label} must be more than 0 m`)
    .max(MAX_SIDE_M, `${label} must be at most ${MAX_SIDE_M} m`);

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
    length_m: side("length").optional(),
    width_m: side("width").optional(),
    polygon: polygonGeometry.optional(),
  },
  "part of a bed's shape",
)
  .superRefine((bed, ctx) => {
    const hasSides = bed.length_m !== undefined || bed.width_m !== undefined;
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
        ctx.addIssue({ code: "custom", path: ["polygon"], message: `An outline can spread at most ${MAX_OUTLINE_SPAN_M} m from end to end` });
      } else if (polygonArea(bed.polygon) > MAX_BED_AREA_M2) {
        ctx.addIssue({ code: "custom", path: ["polygon"], message: `A bed can be at most ${MAX_BED_AREA_M2.toLocaleString("en-US")} m²` });
      }
      return;
    }
    if (bed.length_m === undefined) ctx.addIssue({ code: "custom", path: ["length_m"], message: "Give the bed's length" });
    if (bed.width_m === undefined) ctx.addIssue({ code: "custom", path: ["width_m"], message: "Give the bed's width" });
    if (bed.length_m !== undefined && bed.width_m !== undefined && bed.length_m * bed.width_m > MAX_BED_AREA_M2) {
      ctx.addIssue({ code: "custom", path: [], message: `A bed can be at most ${MAX_BED_AREA_M2.toLocaleString("en-US")} m²` });
    }
  })
  // Out as plain GeoJSON, so callers holding a Turf or Leaflet Polygon can build the type.
  .transform((bed): { length_m: number; width_m: number } | { polygon: Polygon } =>
    bed.polygon ? { polygon: bed.polygon } : { length_m: bed.length_m!, width_m: bed.width_m! },
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

const depthLayer = (r: { min: number; max: number }) =>
  z.union([z.boolean(), strictObject({ depth_cm: inRange("depth", "cm", r).optional() }, "a setting of this layer")], { error: ON_OFF_OR_SETTINGS });

// Sheets shorter than this could not overlap a 30 cm seam and still cover anything.
const sheetSide = z.number().min(0.35, "a sheet side must be at least 0.35 m").max(5, "a sheet side must be at most 5 m");

export const layersSchema = strictObject({
  cardboard: z
    .union([
      z.boolean(),
      strictObject(
        {
          overlap_cm: inRange("overlap", "cm", CARDBOARD_OVERLAP_CM).optional(),
          sheet_length_m: sheetSide.optional(),
          sheet_width_m: sheetSide.optional(),
        },
        "a cardboard setting",
      ).superRefine((c, ctx) => {
        // Wider seams bury most of each sheet, and tiny sheets with wide seams make a grid
        // of millions: refused (lib/calc/cardboard.ts MAX_OVERLAP_SHARE).
        const shorter = Math.min(c.sheet_length_m ?? DEFAULT_CARDBOARD_SHEET.length_m, c.sheet_width_m ?? DEFAULT_CARDBOARD_SHEET.width_m);
        const most = MAX_OVERLAP_SHARE * shorter * 100;
        if ((c.overlap_cm ?? CARDBOARD_OVERLAP_CM.default) > most + 1e-9) {
          ctx.addIssue({ code: "custom", path: ["overlap_cm"], message: `overlap must be at most half the sheet's shorter side, ${Number(most.toFixed(1))} cm` });
        }
      }),
    ], { error: ON_OFF_OR_SETTINGS })
    .optional(),
  leaves: depthLayer(LAYER_DEPTH_CM.leaves).optional(),
  straw: depthLayer(LAYER_DEPTH_CM.straw).optional(),
  wood_chips: depthLayer(LAYER_DEPTH_CM.wood_chips).optional(),
  worms: z
    .union([
      z.boolean(),
      // Bins run at a few kg/m²; past 5 a bed is a worm farm, so treat it as a typo.
      strictObject({ kg_per_m2: z.number().positive("stocking must be more than 0 kg/m²").max(5, "stocking must be at most 5 kg/m²").optional() }, "a worm setting"),
    ], { error: ON_OFF_OR_SETTINGS })
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
}, "part of an estimate request");

export type EstimateInput = z.infer<typeof estimateSchema>;
export type EstimateRequest = z.input<typeof estimateSchema>;
export type EstimateLayers = z.infer<typeof layersSchema>;
