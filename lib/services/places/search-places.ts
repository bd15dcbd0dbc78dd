import "server-only";
import { placesByPrefix, type PlaceHit } from "@/db/places";
import { geocodeSearch } from "@/lib/geo/geocoder";
import { comparePlaces, placeLabel } from "@/lib/geo/place-terms";
import type { Place } from "@/lib/validation/places";
import { resolveContext, type Context } from "@/lib/context";
import { placeView } from "@/lib/services/places/steps/place-view";

// Finding a place by name: the local gazetteer first (towns, villages, streets, postcodes
// with their points), then the geocoding service when one is configured, without the
// places the gazetteer already gave.

const sameSpot = (a: PlaceHit, b: PlaceHit) => placeLabel(a).toLowerCase() === placeLabel(b).toLowerCase() && Math.abs(a.lat - b.lat) < 0.002 && Math.abs(a.lng - b.lng) < 0.003;

export async function searchPlaces(input: { q: string; limit: number; lat?: number; lng?: number }, ctx: Context = {}): Promise<Place[]> {
  const { db: q } = resolveContext(ctx);
  const local = (await placesByPrefix(input.q, input.limit, q)).sort(comparePlaces(input.q)).slice(0, input.limit);
  const out = local.map((p) => placeView(p, "gazetteer"));
  if (out.length < input.limit) {
    const near = input.lat !== undefined && input.lng !== undefined ? { lat: input.lat, lng: input.lng } : undefined;
    const remote = (await geocodeSearch(input.q, input.limit, near)) ?? [];
    for (const p of remote) {
      if (out.length >= input.limit) break;
      if (!local.some((l) => sameSpot(l, p)) && !out.some((o) => sameSpot(o, p))) out.push(placeView(p, "geocoder"));
    }
  }
  return out;
}
