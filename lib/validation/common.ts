import { z } from "zod";
import { isCalendarDate } from "@/lib/calc/timeline";

/** A point on the globe, with a message per coordinate. */
export const locationSchema = z.object({
  lat: z.number({ error: "latitude must be a number" }).min(-90, "latitude must be between -90 and 90").max(90, "latitude must be between -90 and 90"),
  lng: z.number({ error: "longitude must be a number" }).min(-180, "longitude must be between -180 and 180").max(180, "longitude must be between -180 and 180"),
});

/** A row id as the client sends it; an unknown one is a 404 later, not a 422. */
export const idSchema = (what: string) => z.string({ error: `Choose ${what}.` }).trim().min(1, `Choose ${what}.`).max(64, `That is not ${what}.`);

export const calendarDateSchema = z.string({ error: "Give a date as YYYY-MM-DD." }).refine(isCalendarDate, "Give a real date as YYYY-MM-DD.");

/** A note a person writes for the record (moderation outcomes, cancellations). */
export const noteSchema = (min = 3, max = 2000) =>
  z
    .string({ error: "Write a short note." })
    .trim()
    .min(min, `Write at least ${min} characters.`)
    .max(max, `Use at most ${max} characters.`);

/** A number in a query string (every value arrives as text), with the message naming the parameter. */
export const queryNumber = (what: string) =>
  z
    .string()
    .trim()
    .regex(/^-?\d+(\.\d+)?$/, `${what} must be a number.`)
    .transform(Number);
