import { z } from "zod";

// GET /api/places?q=mill&limit=8[&lat=&lng=] and GET /api/places/nearest?lat=&lng=.

const coordinate = (name: "lat" | "lng", max: number) =>
  z.coerce
    .number({ error: `${name} must be a number` })
    .min(-max, `${name} must be between -${max} and ${max}`)
    .max(max, `${name} must be between -${max} and ${max}`);

export const placeSearchSchema = z
  .object({
    q: z.string({ error: "Type part of a place name, street or postcode." }).trim().min(2, "Type at least two letters.").max(100, "Keep it under 100 characters."),
    limit: z.coerce.number({ error: "limit must be a number" }).int("limit must be a whole number").min(1, "limit must be at least 1").max(20, "limit must be at most 20").default(8),
    lat: coordinate("lat", 90).optional(),
    lng: coordinate("lng", 180).optional(),
  })
  .refine((v) => (v.lat === undefined) === (v.lng === undefined), { path: ["lng"], message: "Give lat and lng together, or neither." });

export const nearestPlaceSchema = z.object({ lat: coordinate("lat", 90), lng: coordinate("lng", 180) });

export const placeSchema = z.object({
  id: z.string(),
  kind: z.enum(["town", "village", "postcode", "street", "landmark"]),
  name: z.string(),
  context: z.string().nullable(),
  /** "Mill Leat Lane, Fernhollow". */
  label: z.string(),
  lat: z.number(),
  lng: z.number(),
  source: z.enum(["gazetteer", "geocoder"]),
});

export const placeSearchResponseSchema = z.object({ places: z.array(placeSchema) });
export const nearestPlaceResponseSchema = z.object({ place: placeSchema.nullable() });

export type Place = z.infer<typeof placeSchema>;

/** The query string as the schema reads it (absent parameters left out). */
export function queryParams(params: URLSearchParams, names: readonly string[]): Record<string, string> {
  return Object.fromEntries(names.map((n) => [n, params.get(n)]).filter((e): e is [string, string] => e[1] !== null && e[1] !== ""));
}
