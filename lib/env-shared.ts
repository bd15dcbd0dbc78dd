import { z } from "zod";

// The part of the environment module (lib/env.ts) that code in any bundle may import, the
// browser's included. Next.js writes a `process.env.NEXT_PUBLIC_…` (and NEXT_RUNTIME) into the
// code at build time only where it is spelled out literally, so each variable is named here one
// by one, never looked up by a computed key. In the browser every other variable is unset, so
// a module that runs on both sides (the pickup times) reads its default there.

// An empty value (an untouched `NAME=` line from .env.example) counts as unset.
export const optional = z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? undefined : typeof v === "string" ? v.trim() : v), z.string().optional());

export const sharedSchema = z.object({
  // Map tiles for production (a Leaflet URL template, {s} for subdomains); unset: the
  // shipped base map only. Fixed at build time.
  NEXT_PUBLIC_TILE_URL: optional,
  NEXT_PUBLIC_TILE_ATTRIBUTION: optional,
  // The base map's GeoJSON; unset: the one shipped in public/. Fixed at build time.
  NEXT_PUBLIC_BASEMAP_URL: optional,
  // "nodejs" or "edge": which server runtime runs this code (set by Next.js).
  NEXT_RUNTIME: optional,
  // The zone pickup windows ("Saturdays 09:00–12:00") are written in.
  PICKUP_TIME_ZONE: optional,
});

export type SharedEnv = z.infer<typeof sharedSchema>;

/** The values any bundle may read, read when asked (tests change them). */
export function sharedEnv(): SharedEnv {
  return sharedSchema.parse({
    NEXT_PUBLIC_TILE_URL: process.env.NEXT_PUBLIC_TILE_URL,
    NEXT_PUBLIC_TILE_ATTRIBUTION: process.env.NEXT_PUBLIC_TILE_ATTRIBUTION,
    NEXT_PUBLIC_BASEMAP_URL: process.env.NEXT_PUBLIC_BASEMAP_URL,
    NEXT_RUNTIME: process.env.NEXT_RUNTIME,
    PICKUP_TIME_ZONE: process.env.PICKUP_TIME_ZONE,
  });
}

export const DEFAULT_BASEMAP_URL = "/basemap/fernhollow.geojson";
export const DEFAULT_PICKUP_TIME_ZONE = "Europe/London";
