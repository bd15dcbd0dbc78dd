import { z } from "zod";

export const WEEKDAY_NAMES = ["Sunday", "Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday"] as const;
export const PAUSE_REASONS = ["heat", "frost", "other"] as const;
/** As a buyer reads it: "paused because of …". */
export const PAUSE_REASON_LABELS: Record<(typeof PAUSE_REASONS)[number], string> = { heat: "a heatwave", frost: "frost", other: "the weather" };
/** As the grower picks it. */
export const PAUSE_REASON_CHOICES: Record<(typeof PAUSE_REASONS)[number], string> = { heat: "Heat", frost: "Frost", other: "Other weather" };

export const shippingSchema = z
  .object({
    ship_weekdays: z
      .array(z.number().int().min(0, "Weekdays are 0 (Sunday) to 6.").max(6, "Weekdays are 0 (Sunday) to 6."), { error: "Choose the days parcels go out." })
      .min(1, "Choose at least one day parcels go out.")
      .max(7)
      .refine((d) => new Set(d).size === d.length, "Choose each day once."),
    paused: z.boolean({ error: "Say whether shipping is paused." }),
    pause_reason: z.enum(PAUSE_REASONS, { error: "Choose heat, frost or other." }).nullable().default(null),
    pause_note: z.string().trim().max(200, "Use at most 200 characters.").nullable().default(null),
  })
  .refine((s) => !s.paused || s.pause_reason, { path: ["pause_reason"], message: "Say why shipping is paused: heat, frost or other." });

/** The live-culture side of a worm listing: the species is required (a buyer must know what they get). */
export const cultureSchema = z
  .object({
    species: z
      .string({ error: "Name the species." })
      .trim()
      .min(3, "Name the species, e.g. Eisenia fetida.")
      .max(80, "Use at most 80 characters."),
    ships: z.boolean({ error: "Say whether you post it." }),
    pickup: z.boolean({ error: "Say whether it can be collected." }),
  })
  .refine((c) => c.ships || c.pickup, { path: ["ships"], message: "Offer posting, collection or both." });

export type ShippingInput = z.infer<typeof shippingSchema>;
export type CultureInput = z.infer<typeof cultureSchema>;

/** Marking a posted culture shipped: who carries it and how the buyer follows it. */
export const shipOrderSchema = z.object({
  carrier: z
    .string({ error: "Name the carrier." })
    .trim()
    .min(2, "Name the carrier: the postal service or a courier.")
    .max(60, "Use at most 60 characters."),
  tracking: z
    .string({ error: "Give the tracking number or link." })
    .trim()
    .min(4, "Give the tracking number or link from the receipt.")
    .max(120, "Use at most 120 characters."),
});
/** Packed and delivered take no fields. */
export const orderStepSchema = z.object({});

export type ShipOrderInput = z.infer<typeof shipOrderSchema>;
