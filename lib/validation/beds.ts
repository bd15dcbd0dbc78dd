import { z } from "zod";
import { bedSchema, layersSchema, startDateSchema, strictObject } from "./estimate";
import { locationSchema as location } from "./common";

/** A saved bed: its shape and recipe are exactly what POST /api/estimate takes. */
export const createBedSchema = strictObject({
  name: z.string({ error: "Give the bed a name." }).trim().min(1, "Give the bed a name.").max(80, "Use at most 80 characters."),
  bed: bedSchema,
  layers: layersSchema.optional(),
  start_date: startDateSchema.nullable().optional(),
  /** Where the bed is; taken from the outline when it has one. */
  location: location.nullable().optional(),
}, "part of a saved bed");

export const updateBedSchema = createBedSchema.partial();

export type CreateBedInput = z.infer<typeof createBedSchema>;
export type UpdateBedInput = z.infer<typeof updateBedSchema>;
