// The answer of POST /api/estimate (and a saved bed's estimate), as the OpenAPI document
// describes it. The route builds it in lib/calc/estimate.ts and lib/services/beds/estimate-bed.ts;
// tests/integration/openapi.test.ts checks a real answer against this shape.
import { z } from "zod";
import { LISTING_UNITS, NEED_UNITS_SI } from "@/lib/calc/units";
import { MATERIAL_CODES } from "@/lib/calc/facts";

const material = z.enum(MATERIAL_CODES);
const pair = (what: string) => z.tuple([z.number(), z.number()]).describe(what);
const layer = z.object({ material, depth_cm: z.number(), m3: z.number(), bags: z.number().int(), kg: z.number(), cn_after: z.number(), reaches_range: z.boolean(), capped: z.boolean() });

const need = z
  .object({
    material,
    quantity: z.number().describe("in `unit`: m² of cardboard laid, m³ spread on the bed, kg of worms"),
    unit: z.enum(NEED_UNITS_SI),
    sheets: z.number().int().optional().describe("cardboard: sheets of the chosen size"),
    bags: z.number().int().optional().describe("leaves: 30 US gal bags"),
    bales: z.number().int().optional().describe("straw: small bales, each spread to three times its volume"),
    mass_kg: z.number().optional(),
    depth_cm: z.number().optional(),
    count: z.number().int().optional().describe("worms: about how many"),
  })
  .describe("one layer");

const costs = z
  .object({
    lines: z.array(
      z.object({
        listing_id: z.string(),
        material,
        title: z.string().optional(),
        supplier: z.string().optional(),
        listing_quantity: z.number(),
        listing_unit: z.enum(LISTING_UNITS),
        currency: z.string(),
        cost_cents: z.number().int().describe("paid for this pickup"),
        deposit_cents: z.number().int().describe("held on the card until pickup, returned then"),
        kind: z.enum(["free", "deposit", "paid"]),
      }),
    ),
    totals: z.array(
      z.object({
        currency: z.string(),
        to_pay_cents: z.number().int(),
        deposits_cents: z.number().int(),
        free_pickups: z.number().int(),
        deposit_pickups: z.number().int(),
        paid_pickups: z.number().int(),
      }),
    ),
    by_material: z.array(z.object({ material, currency: z.string(), cost_cents: z.number().int(), deposit_cents: z.number().int(), pickups: z.number().int() })),
    unmet: z.array(z.object({ material, quantity: z.number(), unit: z.enum(NEED_UNITS_SI) })),
  })
  .describe("with `plan` or `match` in the request: what the bed will cost");

export const estimateResponseSchema = z.object({
  area_m2: z.number(),
  needs: z.array(need),
  water_l: z.number().describe("the first soak to pour, the middle of water_range_l, drainage allowance included; rounded to 5 or 10 L"),
  water_us_gal: z.number(),
  water_range_l: pair("least and most to pour, over the published density and moisture spreads"),
  water_range_us_gal: pair("the same in US gallons"),
  water_depth_mm: z.number().describe("water_l as a depth over the bed"),
  water: z.object({
    to_target_l: z.number().describe("what the layers take up to reach the target moisture, at the table's figures"),
    to_target_range_l: pair("the same at the spreads' ends"),
    drainage_share: z.number().describe("allowance for what drains into the soil below (common practice)"),
    target_moisture_pct: z.number(),
    guide: z.string().describe("the squeeze test, the real guide"),
  }),
  blend: z.object({
    cn_ratio: z.number().nullable(),
    moisture_pct: z.number().nullable(),
    advice: z.string().nullable().describe("layers the bed can take, in the request's `units`"),
    bed_advice: z
      .object({
        cn_ratio: z.number(),
        verdict: z.enum(["in_range", "carbon_rich", "nitrogen_rich"]),
        first: layer.nullable(),
        then: z.array(layer),
        patience: z.boolean(),
        text: z.string().nullable(),
      })
      .nullable(),
  }),
  timeline: z.array(
    z.object({
      key: z.enum(["build", "moisture_check", "add_worms", "settling_check", "check_6_months", "plant_into", "ready", "top_up"]),
      date: z.string(),
      title: z.string(),
      detail: z.string().optional(),
      settled_depth_cm: z.number().optional(),
      top_up: z.object({ material: z.enum(["leaves", "grass_clippings"]), depth_cm: z.number(), m3: z.number(), bags: z.number().int() }).optional(),
    }),
  ),
  planting: z.object({
    build: z.string(),
    plant_into_from: z.string().describe("you can plant into it (about 6 months)"),
    plant_into_until: z.string().describe("…by about 9 months"),
    soil_by: z.string().describe("most of the material has turned to soil (about a year)"),
  }),
  settling: z.object({ built_depth_cm: z.number(), after: z.array(z.object({ months: z.number().int(), depth_cm: z.number() })) }),
  top_ups: z.array(z.object({ date: z.string(), material: z.enum(["leaves", "grass_clippings"]), depth_cm: z.number(), m3: z.number(), bags: z.number().int() })),
  cautions: z.array(z.string()),
  centroid: z.object({ lat: z.number(), lng: z.number() }).optional(),
  costs: costs.optional(),
  match: z
    .object({ origin: z.object({ lat: z.number(), lng: z.number() }), radius_km: z.number(), stops: z.number().int(), total_distance_km: z.number(), driving_distance_km: z.number(), trips: z.number().int() })
    .optional(),
});
