import "server-only";
import { searchListings } from "@/db/listing-search";
import { decodeCursor, encodeCursor } from "@/lib/listings/cursor";
import { presentItems, type PublicListingItem } from "@/lib/listings/view";
import { DEFAULT_PAGE, DEFAULT_RADIUS_KM, type BrowseQuery } from "@/lib/validation/listings";
import { searchWords } from "@/lib/listings/search-words";
import { resolveContext, type Context } from "@/lib/context";

export interface BrowseResult {
  items: PublicListingItem[];
  next_cursor: string | null;
}

/** One page of what is on offer: nearest first around a point, else newest first. */
export async function browseListings(query: BrowseQuery, ctx: Context = {}): Promise<BrowseResult> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const point = query.lat !== undefined && query.lng !== undefined ? { lat: query.lat, lng: query.lng } : undefined;
  const by = point ? "distance" : "newest";
  const after = query.cursor ? decodeCursor(query.cursor, by) : null;
  const limit = query.limit ?? DEFAULT_PAGE;
  // One row more than the page tells whether there is another page without counting.
  const rows = await searchListings(
    { point, radiusKm: query.radius_km ?? DEFAULT_RADIUS_KM, materials: query.material, free: query.free, words: searchWords(query.q), now: now.toISOString() },
    after,
    limit + 1,
    q,
  );
  const page = rows.slice(0, limit);
  const last = page.at(-1);
  const next =
    rows.length > limit && last
      ? encodeCursor(point ? { by: "distance", d: last.distance_km ?? 0, id: last.id } : { by: "newest", t: last.created_at, id: last.id })
      : null;
  return { items: await presentItems(page, q, now), next_cursor: next };
}
