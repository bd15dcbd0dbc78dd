// Input to the listing routes and the listing form: one schema per input, shared by both.
// Quantities are stored in the listing's own unit; unit sizes are SI (m² per sheet, m³ per
// bag or bale, kg per bale), so lib/calc can convert them without knowing who typed them.
import { LISTING_UNITS, WHOLE_UNITS, type ListingUnit } from "@/lib/calc/units";
import { z } from "zod";
import { BAG_M3, BALE_M3, DEFAULT_CARDBOARD_SHEET, MATERIAL_CODES, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { queryNumber } from "./common";


/** Units a listing of each material may use; the first is the one the form offers first. */
export const UNITS_BY_MATERIAL: Record<MaterialCode, readonly ListingUnit[]> = {
  cardboard: ["sheets", "m2"],
  leaves: ["bags", "m3", "bales"],
  straw: ["bales"],
  worms: ["kg"],
  grass_clippings: ["bags", "m3", "kg"],
  coffee_grounds: ["kg", "bags", "m3"],
  wood_chips: ["m3", "bags", "kg", "bales"],
  manure: ["bags", "m3", "kg"],
  compost: ["m3", "bags", "kg"],
};

/** Units counted in whole items, where a fraction makes no sense. */

/**
 * What one item of a counted unit holds when the supplier does not say. Only a material that
 * comes baled and spreads out of the bale (straw) has a usual bale; leaves or chips tied into
 * bales must say how big they are.
 */
export function defaultUnitSize(unit: ListingUnit, material?: MaterialCode): number | null {
  if (unit === "sheets") return DEFAULT_CARDBOARD_SHEET.length_m * DEFAULT_CARDBOARD_SHEET.width_m;
  if (unit === "bags") return BAG_M3;
  if (unit === "bales") return material && !MATERIALS[material].bale_expansion ? null : BALE_M3;
  return null;
}

// Product limits, not facts: generous enough for a farm's barn or a council depot, tight
// enough that a typo (an extra three zeros) is caught.
export const MAX_QUANTITY = 100_000;
export const MAX_PRICE_CENTS = 100_000_00;
/** The heaviest pack a culture is sold in, kg (a generous bound on what a grower posts). */
export const MAX_PACK_KG = 25;
export const MAX_DEPOSIT_CENTS = 100_00;
export const MAX_PHOTOS = 6;
export const MAX_PICKUP_WINDOWS = 14;

export const LISTING_CURRENCIES = ["eur", "gbp", "usd"] as const;

// Material-specific declarations. Keys match what the seed and the detail page read.
export const HERBICIDE_HISTORY = ["known_untreated", "unknown"] as const;
export const LEAF_SOURCES = ["garden", "park", "roadside"] as const;
/** Materials that can carry persistent herbicide residues (NC State Extension "Herbicide Carryover"). */
export const HERBICIDE_MATERIALS: readonly MaterialCode[] = ["straw", "manure", "grass_clippings", "compost"];

export const qualitySchema = z
  .object({
    tape_removed: z.boolean({ error: "Say whether tape and staples are removed." }).optional(),
    no_glossy_print: z.boolean({ error: "Say whether there is glossy or coated print." }).optional(),
    herbicide_history: z.enum(HERBICIDE_HISTORY, { error: "Choose what you know about sprays." }).optional(),
    leaf_source: z.enum(LEAF_SOURCES, { error: "Choose where the leaves came from." }).optional(),
    species: z.string().trim().min(3, "Name the worm species (at least 3 letters).").max(80, "Use at most 80 characters.").optional(),
    /** Live cultures: posted to the buyer, collected from the grower, or both (both when not said). */
    ships: z.boolean({ error: "Say whether you post it." }).optional(),
    pickup: z.boolean({ error: "Say whether it can be collected." }).optional(),
  })
  .strict();
export type QualityInput = z.infer<typeof qualitySchema>;

const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time like 17:30.");
const instant = z.iso.datetime({ offset: true, error: "Give a date and time (ISO 8601)." });
/** A calendar date (the form's date input) or a full instant; stored as an instant. */
const dateOrInstant = z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: "Give a date like 2027-03-31." });

export const pickupWindowSchema = z.discriminatedUnion(
  "kind",
  [
    z
      .object({
        kind: z.literal("weekly"),
        weekday: z.number({ error: "Choose a day." }).int().min(0, "Choose a day.").max(6, "Choose a day."),
        start_time: hhmm,
        end_time: hhmm,
      })
      .refine((w) => w.end_time > w.start_time, { path: ["end_time"], message: "End after it starts." }),
    z
      .object({ kind: z.literal("dated"), starts_at: instant, ends_at: instant })
      .refine((w) => Date.parse(w.ends_at) > Date.parse(w.starts_at), { path: ["ends_at"], message: "End after it starts." }),
  ],
  { error: "Choose a weekly or a dated window." },
);
export type PickupWindowInput = z.infer<typeof pickupWindowSchema>;

// ------------------------------------------------------------------------------------
// Photos
// ------------------------------------------------------------------------------------

/** What the browser got back from the upload API, handed to us to attach to a listing. */
export const uploadedPhotoSchema = z.object({
  public_id: z.string({ error: "The upload has no public_id." }).min(1).max(200),
  version: z.number({ error: "The upload has no version." }).int().positive(),
  signature: z.string({ error: "The upload has no signature." }).regex(/^[0-9a-f]{40}$/i, "The upload's signature is not valid."),
  width: z.number().int().positive().max(8000),
  height: z.number().int().positive().max(8000),
  format: z.enum(["jpg", "png", "webp"], { error: "Only JPEG, PNG and WebP photos are kept." }),
});
export type UploadedPhoto = z.infer<typeof uploadedPhotoSchema>;

const money = (what: string, max: number) =>
  z
    .number({ error: `Give the ${what} in cents (0 for none).` })
    .int(`The ${what} is a whole number of cents.`)
    .min(0, `The ${what} cannot be negative.`)
    .max(max, `The ${what} can be at most ${(max / 100).toLocaleString("en-US")}.`);

/** The fields of a listing, each checked on its own; the rules between them come after. */
export const listingFieldsSchema = z.object({
  material: z.enum(MATERIAL_CODES, { error: "Choose a material." }),
  title: z.string({ error: "Give it a title." }).trim().min(3, "Use at least 3 characters.").max(120, "Use at most 120 characters."),
  description: z.string().trim().max(2000, "Use at most 2,000 characters.").default(""),
  unit: z.enum(LISTING_UNITS, { error: "Choose a unit." }),
  unit_size: z.number().positive("The size must be more than 0.").max(100, "That size looks too big.").nullable().optional(),
  unit_mass_kg: z.number().positive("The weight must be more than 0.").max(1000, "That weight looks too big.").nullable().optional(),
  quantity: z.number({ error: "Say how much there is." }).positive("Say how much there is (more than 0).").max(MAX_QUANTITY, "That is more than one listing can hold."),
  price_cents: money("price", MAX_PRICE_CENTS).default(0),
  currency: z.enum(LISTING_CURRENCIES, { error: "Choose a currency." }).default("eur"),
  deposit_cents: money("deposit", MAX_DEPOSIT_CENTS).default(0),
  max_per_reservation: z.number().positive("The most per person must be more than 0.").nullable().optional(),
  /** Live cultures sold by the pack: its size in the listing's unit (kg) and its price; both or neither (lib/listings/packs.ts). */
  pack_size: z.number({ error: "Give the pack's weight." }).positive("A pack must weigh more than 0.").max(MAX_PACK_KG, `A pack can weigh at most ${MAX_PACK_KG} kg.`).nullable().optional(),
  pack_price_cents: money("pack price", MAX_PRICE_CENTS).nullable().optional(),
  auto_accept: z.boolean().default(false),
  location: z.object(
    {
      lat: z.number({ error: "Pick the pickup point on the map." }).min(-90).max(90),
      lng: z.number({ error: "Pick the pickup point on the map." }).min(-180).max(180),
    },
    { error: "Pick the pickup point on the map." },
  ),
  address: z.string({ error: "Give the pickup address." }).trim().min(3, "Give the pickup address.").max(240, "Use at most 240 characters."),
  available_from: dateOrInstant.nullable().optional(),
  available_until: dateOrInstant.nullable().optional(),
  quality: qualitySchema.default({}),
  pickup_windows: z.array(pickupWindowSchema).max(MAX_PICKUP_WINDOWS, `At most ${MAX_PICKUP_WINDOWS} pickup windows.`).default([]),
});

type Fields = z.infer<typeof listingFieldsSchema>;

const isWhole = (x: number) => Math.abs(x - Math.round(x)) < 1e-9;
const startOfInstant = (s: string) => Date.parse(s.length === 10 ? `${s}T00:00:00Z` : s);

/** The rules between fields: units that fit the material, whole counts, declarations that fit. */
export function checkListingRules(l: Fields, ctx: z.RefinementCtx): void {
  const issue = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
  const units = UNITS_BY_MATERIAL[l.material];
  if (!units.includes(l.unit)) issue("unit", `List ${l.material.replace("_", " ")} by ${units.join(" or ")}.`);
  const counted = WHOLE_UNITS.has(l.unit);
  if (counted && !isWhole(l.quantity)) issue("quantity", `Give a whole number of ${l.unit}.`);
  if (!counted && l.unit_size != null) issue("unit_size", "Only sheets, bags and bales have a size.");
  if (counted && l.unit_size == null && defaultUnitSize(l.unit, l.material) === null) issue("unit_size", "Give the size of one bale: only straw bales come in a usual size.");
  if (l.unit !== "bales" && l.unit_mass_kg != null) issue("unit_mass_kg", "Only a bale has a weight of its own.");
  // A cap above the quantity is allowed: it simply never binds (and stays right if the supplier adds more).
  if (l.max_per_reservation != null && counted && !isWhole(l.max_per_reservation)) issue("max_per_reservation", `Give a whole number of ${l.unit}.`);
  const packed = l.pack_size != null || l.pack_price_cents != null;
  if (packed) {
    if (l.material !== "worms") issue("pack_size", "Only live cultures are sold by the pack; price this per unit.");
    else if (l.pack_size == null) issue("pack_size", "Give the pack's weight, or price the culture per kg.");
    else if (l.pack_price_cents == null) issue("pack_price_cents", "Give the price of one pack, or price the culture per kg.");
    else {
      if (l.pack_price_cents === 0) issue("pack_price_cents", "A free culture has no pack price: choose free instead.");
      if (l.pack_size > l.quantity + 1e-9) issue("pack_size", "The listing must hold at least one whole pack.");
      if (l.max_per_reservation != null && !isWhole(l.max_per_reservation / l.pack_size)) issue("max_per_reservation", "Give the most per person as whole packs.");
      if (!isWhole(l.pack_size * 1000)) issue("pack_size", "Give the pack's weight to the gram at most.");
    }
  }
  if (l.available_from && l.available_until && startOfInstant(l.available_until) <= startOfInstant(l.available_from)) {
    issue("available_until", "The end must come after the start.");
  }

  const q = l.quality;
  const allowed = new Set<string>(
    l.material === "cardboard"
      ? ["tape_removed", "no_glossy_print"]
      : l.material === "leaves"
        ? ["leaf_source"]
        : l.material === "worms"
          ? ["species", "ships", "pickup"]
          : HERBICIDE_MATERIALS.includes(l.material)
            ? ["herbicide_history"]
            : [],
  );
  for (const key of Object.keys(q)) {
    if (!allowed.has(key) && q[key as keyof typeof q] !== undefined) issue("quality", `"${key}" does not apply to ${l.material.replace("_", " ")}.`);
  }
  // Buyers must be able to tell which worms they get: some species are invasive in some regions.
  if (l.material === "worms" && !q.species) ctx.addIssue({ code: "custom", path: ["quality", "species"], message: "Name the worm species." });
  if (l.material === "worms" && q.ships === false && q.pickup === false) ctx.addIssue({ code: "custom", path: ["quality", "ships"], message: "Offer posting, collection or both." });
  if (HERBICIDE_MATERIALS.includes(l.material) && !q.herbicide_history) {
    ctx.addIssue({ code: "custom", path: ["quality", "herbicide_history"], message: "Say what you know about sprays on it." });
  }
  if (l.material === "leaves" && !q.leaf_source) ctx.addIssue({ code: "custom", path: ["quality", "leaf_source"], message: "Say where the leaves came from." });
}

export const createListingSchema = listingFieldsSchema
  .extend({
    /** Save without publishing; published listings go straight into browse. */
    status: z.enum(["draft", "active"], { error: "A new listing is a draft or active." }).default("active"),
    photos: z.array(uploadedPhotoSchema).max(MAX_PHOTOS, `At most ${MAX_PHOTOS} photos.`).default([]),
  })
  .superRefine(checkListingRules);
export type CreateListingInput = z.infer<typeof createListingSchema>;
export type ListingFormValues = z.input<typeof createListingSchema>;

/** PATCH: any subset of the fields; the service merges it with the stored listing and checks the rules again. */
export const updateListingSchema = listingFieldsSchema
  .omit({ material: true })
  .extend({
    description: z.string().trim().max(2000, "Use at most 2,000 characters.").optional(),
    price_cents: money("price", MAX_PRICE_CENTS).optional(),
    currency: z.enum(LISTING_CURRENCIES, { error: "Choose a currency." }).optional(),
    deposit_cents: money("deposit", MAX_DEPOSIT_CENTS).optional(),
    auto_accept: z.boolean().optional(),
    quality: qualitySchema.optional(),
    pickup_windows: z.array(pickupWindowSchema).max(MAX_PICKUP_WINDOWS, `At most ${MAX_PICKUP_WINDOWS} pickup windows.`).optional(),
  })
  .partial()
  .strict();
export type UpdateListingInput = z.infer<typeof updateListingSchema>;

export const LISTING_ACTIONS = ["publish", "pause", "resume", "archive"] as const;
export type ListingAction = (typeof LISTING_ACTIONS)[number];
export const listingStatusSchema = z.object({
  action: z.enum(LISTING_ACTIONS, { error: `Choose one of: ${LISTING_ACTIONS.join(", ")}.` }),
});

export const addPhotosSchema = z.object({
  photos: z.array(uploadedPhotoSchema).min(1, "Add at least one photo.").max(MAX_PHOTOS, `At most ${MAX_PHOTOS} photos.`),
});
export const removePhotoSchema = z.object({ photo_id: z.string({ error: "Say which photo to remove." }).min(1).max(36) });
export const reorderPhotosSchema = z.object({
  order: z.array(z.string().min(1).max(36)).min(1, "Give the photos in their new order.").max(MAX_PHOTOS),
});

// ------------------------------------------------------------------------------------
// Browse
// ------------------------------------------------------------------------------------

export const DEFAULT_RADIUS_KM = 25;
export const MAX_RADIUS_KM = 200;
export const DEFAULT_PAGE = 20;
export const MAX_PAGE = 100;

const num = queryNumber;

/** GET /api/listings query string (every value arrives as a string). */
export const browseQuerySchema = z
  .object({
    lat: num("lat").pipe(z.number().min(-90, "lat must be between -90 and 90.").max(90, "lat must be between -90 and 90.")).optional(),
    lng: num("lng").pipe(z.number().min(-180, "lng must be between -180 and 180.").max(180, "lng must be between -180 and 180.")).optional(),
    radius_km: num("radius_km")
      .pipe(z.number().positive("radius_km must be more than 0.").max(MAX_RADIUS_KM, `radius_km can be at most ${MAX_RADIUS_KM}.`))
      .optional(),
    material: z
      .string()
      .trim()
      .transform((s) => s.split(",").map((m) => m.trim()).filter(Boolean))
      .refine((list) => list.every((m) => (MATERIAL_CODES as readonly string[]).includes(m)), `material must be one of: ${MATERIAL_CODES.join(", ")}.`)
      .transform((list) => list as MaterialCode[])
      .optional(),
    free: z
      .enum(["true", "false", "1", "0"], { error: "free must be true or false." })
      .transform((v) => v === "true" || v === "1")
      .optional(),
    q: z.string().trim().max(200, "Search with at most 200 characters.").optional(),
    limit: z
      .string()
      .regex(/^\d+$/, "limit must be a whole number.")
      .transform(Number)
      .pipe(z.number().min(1, "limit must be at least 1.").max(MAX_PAGE, `limit can be at most ${MAX_PAGE}.`))
      .optional(),
    cursor: z.string().max(500, "That cursor is not one of ours.").optional(),
  })
  .superRefine((b, ctx) => {
    if ((b.lat === undefined) !== (b.lng === undefined)) {
      ctx.addIssue({ code: "custom", path: [b.lat === undefined ? "lat" : "lng"], message: "Give both lat and lng, or neither." });
    }
    if (b.radius_km !== undefined && b.lat === undefined) {
      ctx.addIssue({ code: "custom", path: ["radius_km"], message: "A radius needs a point: give lat and lng too." });
    }
  });
export type BrowseQuery = z.infer<typeof browseQuerySchema>;

/** Turns URLSearchParams into the object the schema reads, dropping empty values. */
export function browseParams(search: URLSearchParams | Record<string, string | string[] | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  const entries = search instanceof URLSearchParams ? [...search.entries()] : Object.entries(search);
  for (const [k, v] of entries) {
    const value = Array.isArray(v) ? v[0] : v;
    if (value !== undefined && value !== "") out[k] = value;
  }
  return out;
}

/** The shape GET /api/listings answers with (documentation for the OpenAPI page). */
export const browseResponseSchema = z.object({
  items: z.array(
    z.object({
      id: z.string(),
      material: z.enum(MATERIAL_CODES),
      title: z.string(),
      quantity_available: z.number(),
      unit: z.enum(LISTING_UNITS),
      price_cents: z.number().int(),
      currency: z.string(),
      deposit_cents: z.number().int(),
      pack: z
        .object({ size: z.number().describe("in the listing's unit (kg)"), price_cents: z.number().int() })
        .nullable()
        .describe("sold by the pack (live cultures): reservations are whole packs at price_cents a pack; price_cents above is what a pack works out at per unit"),
      distance_km: z.number().nullable(),
      location: z.object({ lat: z.number(), lng: z.number() }).describe("approximate: a stable offset of a few hundred metres"),
      supplier: z.object({
        id: z.string(),
        name: z.string(),
        verified: z.boolean(),
        rating: z.object({ average: z.number(), count: z.number().int() }).nullable().describe("gardeners' reviews of this supplier after collecting"),
      }),
      photos: z.array(z.object({ url: z.string(), width: z.number().int(), height: z.number().int() })),
      available_until: z.string().nullable(),
    }),
  ),
  next_cursor: z.string().nullable(),
});
