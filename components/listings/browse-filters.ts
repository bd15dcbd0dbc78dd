// The browse filters and their one spelling in the address bar, shared by the page (which
// renders the first page on the server) and the client view (which keeps the URL in step),
// so a copied link opens the same search.
import type { MaterialCode } from "@/lib/calc/facts";
import type { BrowseQuery } from "@/lib/validation/listings";

export interface BrowseFilters {
  q: string;
  material: MaterialCode | "";
  free: boolean;
  /** null: anywhere, newest first. */
  radius_km: number | null;
  point: { lat: number; lng: number } | null;
}

export const RADIUS_CHOICES = [2, 5, 10, 25, 50] as const;
export const BROWSE_PAGE = 20;

export function filtersFrom(q: Partial<BrowseQuery>): BrowseFilters {
  const point = q.lat !== undefined && q.lng !== undefined ? { lat: q.lat, lng: q.lng } : null;
  return {
    q: q.q ?? "",
    material: q.material?.length === 1 ? q.material[0] : "",
    free: q.free === true,
    radius_km: point ? (q.radius_km ?? 25) : null,
    point,
  };
}

/** The query string for a search; `cursor` and `limit` only for the API. */
export function searchString(f: BrowseFilters, extra: { cursor?: string | null; limit?: number } = {}): string {
  const p = new URLSearchParams();
  if (f.q.trim()) p.set("q", f.q.trim());
  if (f.material) p.set("material", f.material);
  if (f.free) p.set("free", "true");
  if (f.point) {
    p.set("lat", String(f.point.lat));
    p.set("lng", String(f.point.lng));
    if (f.radius_km) p.set("radius_km", String(f.radius_km));
  }
  if (extra.limit) p.set("limit", String(extra.limit));
  if (extra.cursor) p.set("cursor", extra.cursor);
  return p.toString();
}
