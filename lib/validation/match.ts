// Input to POST /api/match and the "Find materials" form: needs (or a saved bed), where to
// start from, how far to look, and what the trip may cost and carry.
import { NEED_UNITS_SI } from "@/lib/calc/units";
import { z } from "zod";
import { MATERIAL_CODES, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { DEFAULT_RADIUS_KM, MAX_NEEDS, MAX_RADIUS_KM } from "@/lib/match/defaults";
import type { Need, NeedUnit } from "@/lib/match/types";
import { NEED_UNIT_LABEL, NEED_UNITS } from "@/lib/match/units";

/** A product limit: past this a need is a landscaping contract, not a bed. */
export const MAX_NEED_QUANTITY = 10_000;

const unitList = (m: MaterialCode) => NEED_UNITS[m].map((u) => NEED_UNIT_LABEL[u]).join(" or ");

export const needSchema = z
  .object({
    material: z.enum(MATERIAL_CODES, { error: `Unknown material: use one of ${MATERIAL_CODES.join(", ")}` }),
    quantity: z
      .number({ error: "quantity must be a number" })
      .positive("quantity must be more than 0")
      .max(MAX_NEED_QUANTITY, `quantity must be at most ${MAX_NEED_QUANTITY.toLocaleString("en-US")}`),
    unit: z.enum(NEED_UNITS_SI, { error: "unit must be m2, m3 or kg" }),
  })
  .superRefine((n, ctx) => {
    if (!NEED_UNITS[n.material].includes(n.unit)) {
      ctx.addIssue({
        code: "custom",
        path: ["unit"],
        message: `${MATERIALS[n.material].name} is measured in ${unitList(n.material)}, not ${NEED_UNIT_LABEL[n.unit]}`,
      });
    }
  });

export const originSchema = z.object(
  {
    lat: z.number({ error: "lat must be a number" }).min(-90, "lat must be between -90 and 90").max(90, "lat must be between -90 and 90"),
    lng: z.number({ error: "lng must be a number" }).min(-180, "lng must be between -180 and 180").max(180, "lng must be between -180 and 180"),
  },
  { error: "origin must be an object with lat and lng" },
);

/** How far to look, km; the default when left out. */
export const radiusSchema = z
  .number({ error: "radius_km must be a number" })
  .positive("radius_km must be more than 0 km")
  .max(MAX_RADIUS_KM, `radius_km must be at most ${MAX_RADIUS_KM} km`)
  .default(DEFAULT_RADIUS_KM);

export const matchSchema = z
  .object({
    needs: z
      .array(needSchema, { error: "needs must be a list" })
      .min(1, "Give at least one need")
      .max(MAX_NEEDS, `Give at most ${MAX_NEEDS} needs`)
      .optional(),
    bed_id: z.string({ error: "bed_id must be a string" }).trim().min(1, "bed_id must not be empty").max(64, "bed_id is too long").optional(),
    origin: originSchema.optional(),
    radius_km: radiusSchema,
    vehicle: z
      .object(
        {
          load_l: z.number({ error: "load_l must be a number" }).positive("load_l must be more than 0 L").max(100_000, "load_l must be at most 100,000 L").optional(),
          load_kg: z.number({ error: "load_kg must be a number" }).positive("load_kg must be more than 0 kg").max(40_000, "load_kg must be at most 40,000 kg").optional(),
        },
        { error: "vehicle must be an object with load_l and load_kg" },
      )
      .optional(),
    cost_per_km_cents: z
      .number({ error: "cost_per_km_cents must be a number" })
      .min(0, "cost_per_km_cents must be at least 0")
      .max(10_000, "cost_per_km_cents must be at most 10,000")
      .optional(),
    cost_per_stop_cents: z
      .number({ error: "cost_per_stop_cents must be a number" })
      .min(0, "cost_per_stop_cents must be at least 0")
      .max(100_000, "cost_per_stop_cents must be at most 100,000")
      .optional(),
  })
  .superRefine((m, ctx) => {
    if (!m.needs && !m.bed_id) ctx.addIssue({ code: "custom", path: ["needs"], message: "Give the needs, or the bed_id of one of your beds" });
    // A saved bed brings its own point; ad-hoc needs have to say where to start.
    if (!m.bed_id && !m.origin) ctx.addIssue({ code: "custom", path: ["origin"], message: "Give the origin as {lat, lng}" });
  });

export type MatchInput = z.infer<typeof matchSchema>;
export type MatchRequest = z.input<typeof matchSchema>;

// --- needs in a URL: /match?needs=leaves:0.45:m3,cardboard:3.6:m2 ------------------------

/** Needs from the `needs` query parameter; entries that do not parse are left out and counted. */
export function needsFromParam(param: string | null | undefined): { needs: Need[]; skipped: number } {
  const needs: Need[] = [];
  let skipped = 0;
  for (const part of (param ?? "").split(",").map((s) => s.trim()).filter(Boolean)) {
    const [material, quantity, unit] = part.split(":");
    const parsed = needSchema.safeParse({ material, quantity: Number(quantity), unit });
    if (parsed.success) needs.push(parsed.data as Need);
    else skipped++;
  }
  return { needs: needs.slice(0, MAX_NEEDS), skipped: skipped + Math.max(0, needs.length - MAX_NEEDS) };
}

export function needsToParam(needs: readonly { material: string; quantity: number; unit: NeedUnit | string }[]): string {
  return needs.map((n) => `${n.material}:${n.quantity}:${n.unit}`).join(",");
}
