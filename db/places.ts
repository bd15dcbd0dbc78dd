import type { Db } from "./index";
import { db } from "./index";
import type { PlaceRow } from "./types";
import { normalizePlaceText, placeTerms } from "@/lib/geo/place-terms";

// The gazetteer (migrations/20261209_031_places.ts): places with a point, found by the
// start of any of their terms.

const COLUMNS = ["p.id", "p.kind", "p.name", "p.context", "p.lat", "p.lng"] as const;

export type PlaceHit = Pick<PlaceRow, "id" | "kind" | "name" | "context" | "lat" | "lng">;

const toHit = (r: PlaceHit): PlaceHit => ({ ...r, lat: Number(r.lat), lng: Number(r.lng) });

/** Adds places (and their search terms) that are not there yet; returns how many were new. */
export async function addPlaces(places: Omit<PlaceRow, "created_at">[], at: string, q: Db = db()): Promise<number> {
  const existing = new Set<string>(places.length ? await q("places").whereIn("id", places.map((p) => p.id)).pluck("id") : []);
  let added = 0;
  for (const p of places) {
    if (existing.has(p.id)) continue;
    await q("places").insert({ ...p, created_at: at });
    added++;
    for (const term of placeTerms(p)) await q("place_terms").insert({ place_id: p.id, term }).onConflict(["term", "place_id"]).ignore();
  }
  return added;
}

/**
 * Places with a term that starts with what was typed, at most `limit`. Terms hold only
 * a–z, 0–9 and single spaces, so the prefix has no LIKE wildcards in it.
 */
export async function placesByPrefix(query: string, limit: number, q: Db = db()): Promise<PlaceHit[]> {
  const prefix = normalizePlaceText(query);
  if (!prefix) return [];
  const squeezed = prefix.replace(/ /g, "");
  const ids = q("place_terms")
    .distinct("place_id")
    .where("term", "like", `${prefix}%`)
    .orWhere("term", "like", `${squeezed}%`);
  const rows: PlaceHit[] = await q("places as p").select(...COLUMNS).whereIn("p.id", ids).limit(limit * 4);
  return rows.map(toHit);
}

/** The nearest place to a point within about `km`, or null: a name for "where I am". */
export async function nearestPlace(lat: number, lng: number, km = 3, q: Db = db()): Promise<PlaceHit | null> {
  const dLat = km / 111.2;
  const dLng = km / (111.2 * Math.max(0.1, Math.cos((lat * Math.PI) / 180)));
  const rows: PlaceHit[] = await q("places as p")
    .select(...COLUMNS)
    .whereBetween("p.lat", [lat - dLat, lat + dLat])
    .whereBetween("p.lng", [lng - dLng, lng + dLng])
    .whereIn("p.kind", ["street", "landmark", "village", "town"]);
  let best: PlaceHit | null = null;
  let bestD = Infinity;
  for (const r of rows.map(toHit)) {
    const d = (r.lat - lat) ** 2 + ((r.lng - lng) * Math.cos((lat * Math.PI) / 180)) ** 2;
    if (d < bestD) {
      best = r;
      bestD = d;
    }
  }
  return best;
}
