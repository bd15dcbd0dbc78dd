import "server-only";
import { nearestPlace } from "@/db/places";
import { placeLabel } from "@/lib/geo/place-terms";
import { resolveContext, type Context } from "@/lib/context";

/** The gazetteer's name nearest each point ("Little Sedge"), or null: no outside service, for lists of many points. */
export async function localNamesFor(points: readonly { lat: number; lng: number }[], ctx: Context = {}): Promise<(string | null)[]> {
  const { db: q } = resolveContext(ctx);
  return Promise.all(
    points.map(async (p) => {
      const near = await nearestPlace(p.lat, p.lng, undefined, q);
      return near ? placeLabel(near) : null;
    }),
  );
}
