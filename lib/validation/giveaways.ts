import { z } from "zod";
import { BAG_M3 } from "@/lib/calc/facts";
import { DEFAULT_TIME_ZONE, isTimeZone } from "@/lib/time/zoned";
import { MIN_CARD_CHARGE_CENTS } from "@/lib/payments/money";
import { calendarDateSchema, idSchema, locationSchema, noteSchema } from "./common";

/** What councils hand out on a giveaway day. */
export const GIVEAWAY_MATERIALS = ["leaves", "wood_chips", "compost"] as const;
export const GIVEAWAY_UNITS = ["bags", "m3"] as const;
export type GiveawayMaterial = (typeof GIVEAWAY_MATERIALS)[number];
export type GiveawayUnit = (typeof GIVEAWAY_UNITS)[number];

export const GIVEAWAY_MATERIAL_LABELS: Record<GiveawayMaterial, string> = { leaves: "Leaves", wood_chips: "Wood chips", compost: "Compost" };
export const GIVEAWAY_UNIT_LABELS: Record<GiveawayUnit, string> = { bags: "bags", m3: "m³" };

/** Bags come whole; m³ to the hundredth (a wheelbarrow is about 0.08 m³, so finer means nothing on the day). */
export function giveawayQuantityIssue(quantity: number, unit: GiveawayUnit): string | null {
  if (unit === "bags") return Number.isInteger(quantity) ? null : "Give a whole number of bags.";
  return hundredths(quantity) ? null : "Give m³ to at most 2 decimal places, like 0.25.";
}
const hundredths = (x: number) => Math.abs(x * 100 - Math.round(x * 100)) < 1e-6;

const time = z.string({ error: "Give a time like 09:30." }).regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Give a time like 09:30.");
const instant = z.iso.datetime({ offset: true, error: "Give a date and time (ISO 8601)." });

export const slotInputSchema = z
  .object({
    start: time,
    end: time,
    capacity: z
      .number({ error: "Give how many households fit in the slot." })
      .int("Use a whole number of households.")
      .min(1, "At least one household.")
      .max(1000, "At most 1,000 households a slot."),
  })
  .refine((s) => s.end > s.start, { path: ["end"], message: "The slot must end after it starts." });

const dayFields = {
  material: z.enum(GIVEAWAY_MATERIALS, { error: "Choose leaves, wood chips or compost." }),
  title: z.string({ error: "Give the day a title." }).trim().min(3, "Use at least 3 characters.").max(120, "Use at most 120 characters."),
  notes: z.string().trim().max(2000, "Use at most 2,000 characters."),
  date: calendarDateSchema,
  time_zone: z.string().refine(isTimeZone, "Use a time zone name like Europe/London."),
  location: locationSchema,
  address: z.string({ error: "Give the address households come to." }).trim().min(3, "Give the address households come to.").max(240, "Use at most 240 characters."),
  unit: z.enum(GIVEAWAY_UNITS, { error: "Choose bags or m³." }),
  /** m³ in one bag (bags only); a 30 US gal lawn-and-leaf bag when not given. */
  bag_m3: z.number().positive("A bag holds more than nothing.").max(1, "A bag of at most 1 m³."),
  household_cap: z.number({ error: "Give the most one household may take." }).positive("The cap must be more than 0.").max(100, "At most 100 a household."),
  booking_opens_at: instant.optional(),
  booking_closes_at: instant.optional(),
  cancel_cutoff_hours: z.number().int("Use whole hours.").min(0, "0 hours or more.").max(168, "At most a week (168 hours)."),
  // Held on a card, so 0 (none) or at least the smallest card charge (lib/payments/money.ts).
  deposit_cents: z
    .number()
    .int("Use whole cents.")
    .min(0, "No negative deposits.")
    .max(10_000, "At most 100.00.")
    .refine((v) => v === 0 || v >= MIN_CARD_CHARGE_CENTS.eur, `0 for none, or at least ${(MIN_CARD_CHARGE_CENTS.eur / 100).toFixed(2)}: a card cannot hold less.`),
};

// Defaults apply to a new day only: a change sends just what changes (zod would fill a
// default into a partial schema too, quietly resetting fields on every edit).
const DAY_DEFAULTS = {
  notes: dayFields.notes.default(""),
  time_zone: dayFields.time_zone.default(DEFAULT_TIME_ZONE),
  bag_m3: dayFields.bag_m3.default(BAG_M3),
  cancel_cutoff_hours: dayFields.cancel_cutoff_hours.default(12),
  deposit_cents: dayFields.deposit_cents.default(0),
};

function windowInOrder(d: { booking_opens_at?: string; booking_closes_at?: string; unit?: GiveawayUnit; household_cap?: number }, ctx: z.RefinementCtx) {
  // A change that sends only one of the two is checked against the day in the service.
  const capIssue = d.unit !== undefined && d.household_cap !== undefined ? giveawayQuantityIssue(d.household_cap, d.unit) : null;
  if (capIssue) ctx.addIssue({ code: "custom", path: ["household_cap"], message: capIssue });
  if (d.booking_opens_at && d.booking_closes_at && Date.parse(d.booking_closes_at) <= Date.parse(d.booking_opens_at)) {
    ctx.addIssue({ code: "custom", path: ["booking_closes_at"], message: "Booking must close after it opens." });
  }
}

export const createGiveawaySchema = z
  .object({ ...dayFields, ...DAY_DEFAULTS, slots: z.array(slotInputSchema).max(48, "At most 48 slots a day.").default([]) })
  .superRefine(windowInOrder);

export const updateGiveawaySchema = z.object(dayFields).partial().superRefine(windowInOrder);

export const addSlotsSchema = z.object({ slots: z.array(slotInputSchema).min(1, "Add at least one slot.").max(48, "At most 48 slots a day.") });
export const updateSlotSchema = z.object({ capacity: slotInputSchema.shape.capacity });

export const cancelGiveawaySchema = z.object({ reason: noteSchema(3, 500) });

export const bookingSchema = z.object({
  slot_id: idSchema("a time slot"),
  // Whole bags or m³ to 2 places: the day's unit is checked in the service (and by the form).
  quantity: z
    .number({ error: "Say how much you will take." })
    .positive("Take more than nothing.")
    .refine(hundredths, "Give at most 2 decimal places."),
});

export const attendanceSchema = z.object({
  status: z.enum(["checked_in", "booked", "no_show"], { error: "Choose checked in, booked or no-show." }),
});

const coord = (min: number, max: number, name: string) =>
  z.coerce.number({ error: `${name} must be a number` }).min(min, `${name} must be between ${min} and ${max}`).max(max, `${name} must be between ${min} and ${max}`);

export const giveawaySearchSchema = z
  .object({
    lat: coord(-90, 90, "latitude").optional(),
    lng: coord(-180, 180, "longitude").optional(),
    radius_km: z.coerce.number({ error: "radius_km must be a number" }).positive("radius_km must be more than 0").max(200, "radius_km of at most 200").default(25),
  })
  .refine((q) => (q.lat === undefined) === (q.lng === undefined), { path: ["lng"], message: "Give both lat and lng, or neither." });

export type CreateGiveawayInput = z.infer<typeof createGiveawaySchema>;
export type UpdateGiveawayInput = z.infer<typeof updateGiveawaySchema>;
export type SlotInput = z.infer<typeof slotInputSchema>;
