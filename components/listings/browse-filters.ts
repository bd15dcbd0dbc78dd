// The browse filters and their one spelling in the address bar, shared by the page (which
// renders the first page on the server) and the client view (which keeps the URL in step),
// so a copied link opens the same search.
import type { MaterialCode } from "@/lib/calc/facts";
import type { BrowseQuery } from "@/lib/validation/listings";

/** The five lanes browse is arranged in: what a bed is built from, and the extras that go with it. */
export const LANES = [
  { id: "cardboard", name: "Cardboard", materials: ["cardboard"] },
  { id: "leaves", name: "Leaves", materials: ["leaves"] },
  { id: "straw", name: "Straw", materials: ["straw"] },
  { id: "worms", name: "Worms", materials: ["worms"] },
  { id: "extras", name: "Greens, chips and compost", materials: ["grass_clippings", "coffee_grounds", "manure", "wood_chips", "compost"] },
] as const satisfies readonly { id: string; name: string; materials: readonly MaterialCode[] }[];

export type LaneId = (typeof LANES)[number]["id"];

export function laneOf(material: MaterialCode): LaneId {
  return LANES.find((l) => (l.materials as readonly MaterialCode[]).includes(material))!.id;
}

/** How much a gardener is after, by the room it takes as handed over (litres). */
export const AMOUNT_CHOICES = [
  { id: "", label: "Any amount", min_l: 0 },
  { id: "bags", label: "At least a few bags", min_l: 50 },
  { id: "carload", label: "At least a carload", min_l: 300 },
  { id: "trailer", label: "A trailer-load or more", min_l: 1000 },
] as const;

/** When the gardener can go and collect. */
export const WHEN_CHOICES = [
  { id: "", label: "Any time" },
  { id: "now", label: "Ready to collect now" },
  { id: "week", label: "Still there in a week" },
] as const;

export interface BrowseFilters {
  q: string;
  /** Empty: every material. */
  materials: MaterialCode[];
  free: boolean;
  /** null: anywhere, newest first. */
  radius_km: number | null;
  point: { lat: number; lng: number } | null;
  /** Filters answered in the browser from what the page holds. */
  amount: (typeof AMOUNT_CHOICES)[number]["id"];
  when: (typeof WHEN_CHOICES)[number]["id"];
}

export const RADIUS_CHOICES = [
  { km: 2, how: "a walk" },
  { km: 5, how: "a bike ride" },
  { km: 10, how: "a short drive" },
  { km: 25, how: null },
  { km: 50, how: "a day out" },
] as const;
export const BROWSE_PAGE = 20;

const pick = <T extends readonly { id: string }[]>(choices: T, value: string | undefined): T[number]["id"] => choices.find((c) => c.id === value)?.id ?? "";

export function filtersFrom(q: Partial<BrowseQuery>, extra: { amount?: string; when?: string } = {}): BrowseFilters {
  const point = q.lat !== undefined && q.lng !== undefined ? { lat: q.lat, lng: q.lng } : null;
  return {
    q: q.q ?? "",
    materials: q.material ?? [],
    free: q.free === true,
    radius_km: point ? (q.radius_km ?? 25) : null,
    point,
    amount: pick(AMOUNT_CHOICES, extra.amount),
    when: pick(WHEN_CHOICES, extra.when),
  };
}

/** The query string for a search; `cursor` and `limit` only for the API, `amount` and `when` only for the page. */
export function searchString(f: BrowseFilters, extra: { cursor?: string | null; limit?: number; page?: boolean } = {}): string {
  const p = new URLSearchParams();
  if (f.q.trim()) p.set("q", f.q.trim());
  if (f.materials.length) p.set("material", f.materials.join(","));
  if (f.free) p.set("free", "true");
  if (f.point) {
    p.set("lat", String(f.point.lat));
    p.set("lng", String(f.point.lng));
    if (f.radius_km) p.set("radius_km", String(f.radius_km));
  }
  if (extra.page) {
    if (f.amount) p.set("amount", f.amount);
    if (f.when) p.set("when", f.when);
  }
  if (extra.limit) p.set("limit", String(extra.limit));
  if (extra.cursor) p.set("cursor", extra.cursor);
  return p.toString();
}
