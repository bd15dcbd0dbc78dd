import { z } from "zod";

// The part of the environment module (lib/env.ts) that code in any bundle may import, the
// browser's included, so lib/env.ts itself (the signing keys, the startup checks) never ends
// up in one. Next.js writes a `process.env.NEXT_PUBLIC_…` into the code at build time only
// where it is spelled out literally, so each variable is named here one by one, never looked
// up by a computed key. In the browser every other variable is unset, so the two read by
// modules that run on both sides (the reservation policy, the pickup times) are their
// defaults there; the server reads them from its environment.

// An empty value (an untouched `NAME=` line from .env.example) counts as unset.
export const optional = z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? undefined : typeof v === "string" ? v.trim() : v), z.string().optional());

// A number always read leniently: one that is not fit for its use counts as unset (the
// default applies), so it never stops a start.
export const number = (fits: (n: number) => boolean) =>
  optional.transform((v) => {
    const n = Number(v);
    return v !== undefined && fits(n) ? n : undefined;
  });

export const sharedSchema = z.object({
  // Map tiles for production (a Leaflet URL template, {s} for subdomains); unset: the
  // shipped base map only. Fixed at build time.
  NEXT_PUBLIC_TILE_URL: optional,
  NEXT_PUBLIC_TILE_ATTRIBUTION: optional,
  // The base map's GeoJSON; unset: the one shipped in public/. Fixed at build time.
  NEXT_PUBLIC_BASEMAP_URL: optional,
  // The zone pickup windows ("Saturdays 09:00–12:00") are written in.
  PICKUP_TIME_ZONE: optional,
  // Minutes a new reservation holds its quantity (lib/reservations/policy.ts; default 30).
  HOLD_MINUTES: number((n) => Number.isFinite(n) && n > 0),
});

export type SharedEnv = z.infer<typeof sharedSchema>;

/**
 * The values any bundle may read, read when asked (tests change them); from `env` instead of
 * the process's environment when one is given (tests).
 */
export function sharedEnv(env?: Record<string, string | undefined>): SharedEnv {
  if (env) return sharedSchema.parse(env);
  return sharedSchema.parse({
    NEXT_PUBLIC_TILE_URL: process.env.NEXT_PUBLIC_TILE_URL,
    NEXT_PUBLIC_TILE_ATTRIBUTION: process.env.NEXT_PUBLIC_TILE_ATTRIBUTION,
    NEXT_PUBLIC_BASEMAP_URL: process.env.NEXT_PUBLIC_BASEMAP_URL,
    PICKUP_TIME_ZONE: process.env.PICKUP_TIME_ZONE,
    HOLD_MINUTES: process.env.HOLD_MINUTES,
  });
}

export const DEFAULT_BASEMAP_URL = "/basemap/fernhollow.geojson";
export const DEFAULT_PICKUP_TIME_ZONE = "Europe/London";
