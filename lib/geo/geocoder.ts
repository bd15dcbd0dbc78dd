import "server-only";
import { readEnv, type Env } from "@/lib/env";
import type { PlaceHit } from "@/db/places";

// A geocoding service for the places the local gazetteer does not hold: anything that speaks
// Photon's open HTTP API (a self-hosted Photon, or a compatible provider) at GEOCODER_URL —
//   GET {GEOCODER_URL}/api?q=mill%20lane&limit=8[&lat=…&lon=…]   (search, GeoJSON back)
//   GET {GEOCODER_URL}/reverse?lat=…&lon=…                      (nearest named place)
// The local fake (lib/fakes/geocoder) speaks the same, so development and the tests go
// through this very code. A slow or failing service leaves the gazetteer's answer standing.

const TIMEOUT_MS = 3000;

interface PhotonFeature {
  geometry?: { type?: string; coordinates?: [number, number] };
  properties?: Record<string, unknown>;
}

const text = (v: unknown) => (typeof v === "string" && v.trim() ? v.trim() : null);

function kindOf(p: Record<string, unknown>): PlaceHit["kind"] {
  const type = text(p.type) ?? text(p.osm_value) ?? "";
  if (type === "city" || type === "town") return "town";
  if (["village", "hamlet", "locality", "suburb", "district"].includes(type)) return "village";
  if (type === "street") return "street";
  if (type === "postcode") return "postcode";
  return "landmark";
}

/** A Photon feature as a place; null when it has no point or no name. */
export function placeFromFeature(f: PhotonFeature, index: number): PlaceHit | null {
  const [lng, lat] = f.geometry?.coordinates ?? [];
  const p = f.properties ?? {};
  const name = text(p.name) ?? (text(p.street) ? `${text(p.housenumber) ? `${text(p.housenumber)} ` : ""}${text(p.street)}` : null) ?? text(p.postcode);
  if (!name || !Number.isFinite(lat) || !Number.isFinite(lng) || Math.abs(lat!) > 90 || Math.abs(lng!) > 180) return null;
  const context = text(p.city) ?? text(p.town) ?? text(p.village) ?? text(p.district) ?? text(p.county);
  const id = text(String(p.osm_id ?? "")) ? `geo:${String(p.osm_type ?? "")}${String(p.osm_id)}` : `geo:${index}:${lat},${lng}`;
  return { id, kind: kindOf(p), name, context: context === name ? null : context, lat: lat!, lng: lng! };
}

export const geocoderConfigured = (env?: Env) => !!readEnv(env).GEOCODER_URL;

async function ask(path: string, params: Record<string, string>): Promise<PhotonFeature[] | null> {
  const base = readEnv().GEOCODER_URL;
  if (!base) return null;
  const url = new URL(`${base.replace(/\/+$/, "")}${path}`);
  for (const [k, v] of Object.entries(params)) url.searchParams.set(k, v);
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(TIMEOUT_MS), headers: { accept: "application/json" } });
    if (!res.ok) throw new Error(`HTTP ${res.status}`);
    const body = (await res.json()) as { features?: PhotonFeature[] };
    return Array.isArray(body.features) ? body.features : [];
  } catch (err) {
    console.error(`[geocoder] ${path} failed: ${err instanceof Error ? err.message : String(err)}`);
    return null;
  }
}

/** Places the service knows by that name, best first (null: not configured, or it did not answer). */
export async function geocodeSearch(query: string, limit: number, near?: { lat: number; lng: number }): Promise<PlaceHit[] | null> {
  const features = await ask("/api", { q: query, limit: String(limit), lang: "en", ...(near ? { lat: String(near.lat), lon: String(near.lng) } : {}) });
  return features ? features.map(placeFromFeature).filter((p): p is PlaceHit => p !== null) : null;
}

/** The service's name for a point, or null. */
export async function geocodeReverse(lat: number, lng: number): Promise<PlaceHit | null> {
  const features = await ask("/reverse", { lat: String(lat), lon: String(lng), limit: "1", lang: "en" });
  return features?.map(placeFromFeature).find((p): p is PlaceHit => p !== null) ?? null;
}
