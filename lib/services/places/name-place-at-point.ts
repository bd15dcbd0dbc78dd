import "server-only";
import { nearestPlace } from "@/db/places";
import { geocodeReverse } from "@/lib/geo/geocoder";
import type { Place } from "@/lib/validation/places";
import { placeView } from "@/lib/services/places/steps/place-view";
import { resolveContext, type Context } from "@/lib/context";

/** A name for a point ("near Mill Leat Lane, Fernhollow"): the gazetteer's nearest place, else the service's. */
export async function nameForPoint(lat: number, lng: number, ctx: Context = {}): Promise<Place | null> {
  const { db: q } = resolveContext(ctx);
  const local = await nearestPlace(lat, lng, undefined, q);
  if (local) return placeView(local, "gazetteer");
  const remote = await geocodeReverse(lat, lng);
  return remote ? placeView(remote, "geocoder") : null;
}
