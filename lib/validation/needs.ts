// Open needs: what a gardener still wants, where, how far they will go and by when; and the
// two aggregate questions others may ask about them. Shared by the forms and the handlers.
import { NEED_UNITS_SI } from "@/lib/calc/units";
import { z } from "zod";
import { MATERIAL_CODES, MATERIALS } from "@/lib/calc/facts";
import { ApiError, parseInput } from "@/lib/api/errors";
import { NEED_UNIT_LABEL, NEED_UNITS } from "@/lib/match/units";
import { MAX_NEED_RADIUS_KM, DEFAULT_NEED_RADIUS_KM } from "@/lib/needs/reach";
import { NEED_INPUT_UNITS, siUnitOf, toSiNeed, type NeedInputUnit } from "@/lib/needs/units";
import { MAX_NEED_QUANTITY } from "./match";
import { calendarDateSchema, idSchema, locationSchema, queryNumber } from "./common";

export const NEED_ALERT_MODES = ["daily", "immediate"] as const;
export type NeedAlertMode = (typeof NEED_ALERT_MODES)[number];
/** The furthest ahead a need may be dated, days (a product limit: two growing seasons). */
export const MAX_NEED_DAYS_AHEAD = 730;

const DAY_MS = 86_400_000;
const today = (now: Date) => now.toISOString().slice(0, 10);

/** Why a "needed by" day cannot be used at `now`, or null (today itself is fine). */
export function neededByIssue(day: string, now: Date): string | null {
  if (day < today(now)) return "needed_by is in the past: give today or a later date";
  if (day > new Date(now.getTime() + MAX_NEED_DAYS_AHEAD * DAY_MS).toISOString().slice(0, 10)) return "needed_by must be within two years";
  return null;
}

const material = z.enum(MATERIAL_CODES, { error: `Unknown material: use one of ${MATERIAL_CODES.join(", ")}` });
const quantity = z
  .number({ error: "quantity must be a number" })
  .positive("quantity must be more than 0")
  .max(MAX_NEED_QUANTITY, `quantity must be at most ${MAX_NEED_QUANTITY.toLocaleString("en-US")}`);
// Stored in SI; given in any of these (12 "bags" of leaves, 20 "lb" of grounds).
const unit = z.enum(NEED_INPUT_UNITS, { error: `unit must be one of ${NEED_INPUT_UNITS.join(", ")}` });
const radius = z
  .number({ error: "radius_km must be a number" })
  .positive("radius_km must be more than 0 km")
  .max(MAX_NEED_RADIUS_KM, `radius_km must be at most ${MAX_NEED_RADIUS_KM} km`);
const neededBy = calendarDateSchema.superRefine((d, ctx) => {
  const issue = neededByIssue(d, new Date());
  if (issue) ctx.addIssue({ code: "custom", message: issue });
});
const alerts = z.enum(NEED_ALERT_MODES, { error: "alerts must be daily (one e-mail a day at most) or immediate" });

/** Why a material cannot be measured in a unit, or null. */
export function unitIssue(m: (typeof MATERIAL_CODES)[number], u: NeedInputUnit): string | null {
  const si = siUnitOf(u);
  return NEED_UNITS[m].includes(si) ? null : `${MATERIALS[m].name} is measured in ${NEED_UNITS[m].map((x) => NEED_UNIT_LABEL[x]).join(" or ")}, not ${NEED_UNIT_LABEL[si]}`;
}

/** A quantity given with its unit, as it is stored: SI. */
function inSi<T extends { quantity?: number; unit?: NeedInputUnit }>(n: T): Omit<T, "unit"> & { unit?: (typeof NEED_UNITS_SI)[number] } {
  if (n.unit === undefined) return n as Omit<T, "unit">;
  if (n.quantity === undefined) return { ...n, unit: siUnitOf(n.unit) };
  return { ...n, ...toSiNeed(n.quantity, n.unit) };
}

/**
 * Other names clients use for the same fields ("radius", "deadline", "amount" …): read as the
 * field, and an error about it is reported under both names.
 */
export const NEED_FIELD_ALIASES: Record<string, readonly string[]> = {
  material: ["material_code"],
  quantity: ["amount", "qty"],
  radius_km: ["radius", "distance_km", "max_distance_km", "within_km"],
  needed_by: ["by", "by_date", "deadline", "needed_by_date", "date", "until"],
  location: ["point", "place", "origin"],
  alerts: ["alert", "notify", "frequency"],
};

/** A body with its aliases read as the fields they stand for, lat and lng beside the others folded into location. */
function normalise(v: unknown): unknown {
  if (!v || typeof v !== "object" || Array.isArray(v)) return v;
  const o: Record<string, unknown> = { ...(v as Record<string, unknown>) };
  for (const [field, names] of Object.entries(NEED_FIELD_ALIASES)) {
    for (const name of names) {
      if (o[field] === undefined && o[name] !== undefined) o[field] = o[name];
      delete o[name];
    }
  }
  if (o.location === undefined && (o.lat !== undefined || o.lng !== undefined)) {
    o.location = { lat: o.lat, lng: o.lng };
  }
  delete o.lat;
  delete o.lng;
  // A date and time ("2027-03-01T00:00:00Z") is read as the calendar day it was written on.
  if (typeof o.needed_by === "string" && /^\d{4}-\d{2}-\d{2}T/.test(o.needed_by) && !Number.isNaN(Date.parse(o.needed_by))) o.needed_by = o.needed_by.slice(0, 10);
  return o;
}

/** parseInput for a need's body: an error about a field is also given under the alias the client sent. */
export function parseNeedBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  try {
    return parseInput(schema, body);
  } catch (err) {
    if (!(err instanceof ApiError) || !err.fields || !body || typeof body !== "object") throw err;
    const sent = body as Record<string, unknown>;
    const fields = { ...err.fields };
    for (const [key, message] of Object.entries(err.fields)) {
      const [field, ...rest] = key.split(".");
      for (const alias of NEED_FIELD_ALIASES[field] ?? []) if (sent[alias] !== undefined) fields[[alias, ...rest].join(".")] ??= message;
      if (field === "location" && sent.location === undefined) for (const c of ["lat", "lng"]) if (rest[0] === c || !rest.length) fields[c] ??= message;
    }
    throw new ApiError(err.code, err.message, fields);
  }
}

/** A need to open, with its place as `location` (the form sends exactly this). */
export const openNeedFieldsSchema = z
  .object({
    material,
    quantity,
    /** SI: m2, m3 or kg; the material's usual one when left out. */
    unit: unit.optional(),
    radius_km: radius.default(DEFAULT_NEED_RADIUS_KM),
    /** YYYY-MM-DD; the bed's build day (or eight weeks ahead) when left out. */
    needed_by: neededBy.optional(),
    location: locationSchema.optional(),
    bed_id: idSchema("a bed").optional(),
    alerts: alerts.default("daily"),
  })
  .superRefine((n, ctx) => {
    const issue = n.unit ? unitIssue(n.material, n.unit) : null;
    if (issue) ctx.addIssue({ code: "custom", path: ["unit"], message: issue });
    if (!n.location && !n.bed_id) ctx.addIssue({ code: "custom", path: ["location"], message: "Give the place as location {lat, lng}, or the bed_id of one of your beds" });
  })
  .transform(inSi);

/** POST /api/needs: a typed need, or a saved bed's unmet one (bed_id brings the bed's place). */
export const openNeedSchema = z.preprocess(normalise, openNeedFieldsSchema);

/** PATCH /api/needs/:id: change the amount, reach, date or alerts; close it, or open it again. */
export const updateNeedSchema = z.preprocess(
  normalise,
  z
    .object({
      /** A need keeps its material (its alerts are for it): the same one is accepted, another is refused. */
      material: material.optional(),
      quantity: quantity.optional(),
      unit: unit.optional(),
      radius_km: radius.optional(),
      needed_by: neededBy.optional(),
      location: locationSchema.optional(),
      alerts: alerts.optional(),
      status: z.enum(["open", "closed"], { error: "status must be open or closed" }).optional(),
    })
    .refine((p) => Object.values(p).some((v) => v !== undefined), { message: "Give at least one of quantity, unit, radius_km, needed_by, location, alerts or status", path: ["_"] })
    .refine((p) => p.unit === undefined || p.quantity !== undefined || siUnitOf(p.unit) === p.unit, { message: "Give the quantity with a unit like bags or lb", path: ["quantity"] })
    .transform(inSi),
);

export type OpenNeedInput = z.infer<typeof openNeedSchema>;
export type UpdateNeedInput = z.infer<typeof updateNeedSchema>;

const queryMaterial = z.enum(MATERIAL_CODES, { error: `material must be one of: ${MATERIAL_CODES.join(", ")}` });
const lat = queryNumber("lat").pipe(z.number().min(-90, "lat must be between -90 and 90").max(90, "lat must be between -90 and 90"));
const lng = queryNumber("lng").pipe(z.number().min(-180, "lng must be between -180 and 180").max(180, "lng must be between -180 and 180"));

/** GET /api/needs/nearby-demand?lat&lng&material: the aggregates a supplier may see. */
export const nearbyDemandQuerySchema = z.object({
  lat: z.string({ error: "Give lat" }).pipe(lat).describe("Latitude of the pickup point, decimal degrees (-90 to 90)"),
  lng: z.string({ error: "Give lng" }).pipe(lng).describe("Longitude of the pickup point, decimal degrees (-180 to 180)"),
  material: z.string({ error: "Give material" }).pipe(queryMaterial).describe(`The listing's material: ${MATERIAL_CODES.join(", ")}`),
});

/** GET /api/council/demand(.csv): open needs by cell around a point (the council's own by default). */
export const councilDemandQuerySchema = z.object({
  material: queryMaterial.default("leaves"),
  lat: lat.optional(),
  lng: lng.optional(),
  radius_km: queryNumber("radius_km")
    .pipe(z.number().positive("radius_km must be more than 0").max(MAX_NEED_RADIUS_KM, `radius_km must be at most ${MAX_NEED_RADIUS_KM}`))
    .optional(),
});

/** GET /api/needs?status=open|all (what GET lists; open by default). */
export const listNeedsQuerySchema = z.object({
  status: z.enum(["open", "all"], { error: "status must be open or all" }).default("all"),
  bed_id: idSchema("a bed").optional(),
});

const needUnitOut = z.enum(NEED_UNITS_SI);

/** One need, as its owner sees it (documentation for the OpenAPI page). */
export const needResponseSchema = z.object({
  id: z.string(),
  material: z.enum(MATERIAL_CODES),
  quantity: z.number(),
  unit: needUnitOut,
  quantity_reserved: z.number(),
  quantity_left: z.number(),
  radius_km: z.number(),
  needed_by: z.string(),
  location: z.object({ lat: z.number(), lng: z.number() }),
  bed: z.object({ id: z.string(), name: z.string() }).nullable(),
  alerts: z.enum(NEED_ALERT_MODES),
  status: z.enum(["open", "met", "expired", "closed"]),
  alert_count: z.number().int(),
  created_at: z.string(),
  closed_at: z.string().nullable(),
});

export const ringResponseSchema = z.object({
  radius_km: z.number(),
  needs: z.number().int(),
  people: z.number().int(),
  quantity: z.number().nullable(),
  unit: needUnitOut,
});

export const nearbyDemandResponseSchema = z.object({
  material: z.enum(MATERIAL_CODES),
  rings: z.array(ringResponseSchema),
  min_people: z.number().int(),
});

/** PATCH /api/needs/alerts/:id: I have seen it, or I do not want it any more. */
export const updateAlertSchema = z
  .object({
    seen: z.literal(true, { error: "seen can only be true" }).optional(),
    dismissed: z.literal(true, { error: "dismissed can only be true" }).optional(),
  })
  .refine((a) => a.seen || a.dismissed, { message: "Give seen: true or dismissed: true", path: ["_"] });

/** GET /api/needs/alerts?open=true|false. */
export const listAlertsQuerySchema = z.object({
  open: z.enum(["true", "false"], { error: "open must be true or false" }).default("true"),
});
