import { z } from "zod";

const id = (what: string) => z.string({ error: `Choose ${what}.` }).trim().min(1, `Choose ${what}.`).max(64, `That is not a valid ${what.replace(/^(a|an|the) /, "")}.`);

// Quantities are in the listing's own unit (bales, bags, sheets, kg, m³, m²). Whether a
// fraction is allowed depends on that unit, which only the service knows.
export const quantitySchema = z
  .number({ error: "Give a quantity as a number." })
  .finite("Give a quantity as a number.")
  .positive("Reserve more than zero.")
  .max(100_000, "That is more than any listing holds.");

export const FULFILMENT_CHOICES = ["pickup", "post"] as const;

const shipToSchema = z
  .string({ error: "Give the address as text." })
  .trim()
  .max(400, "Keep the address under 400 characters.")
  .nullish()
  .transform((v) => v || null);

export const reserveOneSchema = z
  .object({
    listing_id: id("a listing"),
    quantity: quantitySchema,
    pickup_window_id: id("a pickup window").nullish(),
    bed_id: id("a bed").nullish(),
    /** The open need this is for (reserving from an alert): it counts towards meeting it. */
    need_id: id("a need").nullish(),
    // Live cultures only: collected (the default where offered) or posted to `ship_to`.
    fulfilment: z.enum(FULFILMENT_CHOICES, { error: "Choose collection or post." }).nullish(),
    ship_to: shipToSchema,
  })
  .refine((r) => r.fulfilment !== "post" || (r.ship_to && r.ship_to.length >= 10), {
    path: ["ship_to"],
    message: "Give the full postal address the parcel goes to, with the postcode.",
  });

/** One item of "Reserve all": a stop with its pickup window, or a live culture to post with its address. */
export const reserveItemSchema = z
  .object({
    listing_id: id("a listing"),
    quantity: quantitySchema,
    pickup_window_id: id("a pickup window").nullish(),
    fulfilment: z.enum(FULFILMENT_CHOICES, { error: "Choose collection or post." }).nullish(),
    ship_to: shipToSchema,
  })
  .refine((r) => r.fulfilment !== "post" || !r.ship_to || r.ship_to.length >= 10, {
    path: ["ship_to"],
    message: "Give the full postal address the parcel goes to, with the postcode.",
  });

/** "Reserve all" from a match plan: one reservation per item, all or nothing. */
export const reserveManySchema = z.object({
  items: z.array(reserveItemSchema, { error: "List what to reserve." }).min(1, "List at least one listing.").max(20, "Reserve at most 20 listings at once."),
  bed_id: id("a bed").nullish(),
  /** The open need this is for: it counts for the items of its material. */
  need_id: id("a need").nullish(),
});

export const createReservationSchema = z.union([reserveManySchema, reserveOneSchema]);

export type ReserveOneInput = z.infer<typeof reserveOneSchema>;
export type ReserveManyInput = z.infer<typeof reserveManySchema>;

export const collectSchema = z.object({
  // Optional: the supplier may type the gardener's code, or simply mark it collected.
  pickup_code: z.string().trim().max(20, "A pickup code is 6 characters.").optional(),
});

export const cancelSchema = z.object({
  reason: z.string().trim().max(500, "Keep the reason under 500 characters.").optional(),
});
export const declineSchema = cancelSchema;

export const messageSchema = z.object({
  body: z
    .string({ error: "Write a message." })
    .trim()
    .min(1, "Write a message.")
    .max(2000, "Keep a message under 2,000 characters."),
});

export const reviewSchema = z.object({
  rating: z
    .number({ error: "Choose 1 to 5." })
    .int("Choose a whole number from 1 to 5.")
    .min(1, "Choose 1 to 5.")
    .max(5, "Choose 1 to 5."),
  comment: z.string().trim().max(1000, "Keep the comment under 1,000 characters.").default(""),
});

export type ReviewInput = z.infer<typeof reviewSchema>;

export const confirmSchema = z.object({});
export const noShowSchema = cancelSchema;
