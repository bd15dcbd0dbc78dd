import { inBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";
import type { CandidateSource } from "@/lib/match/search";
import type { CandidateListing, LatLng } from "@/lib/match/types";
import { UNIT_PRICE_SQL } from "@/migrations/20261201_004_listing_unit_price";
import { prng } from "@/seeds/ids";
import { candidateListing } from "../factories/listings";

export const FERNHOLLOW: LatLng = { lat: 52.205, lng: 0.847 };

/** The price per unit size the unit-price index orders by (the same rule as UNIT_PRICE_SQL). */
export function unitPrice(l: CandidateListing): number {
  void UNIT_PRICE_SQL;
  return l.price_cents / (["sheets", "bags", "bales"].includes(l.unit) && (l.unit_size ?? 0) > 0 ? l.unit_size! : 1);
}

/** The database's queries over an array, for the search's own tests. */
export function memorySource(all: readonly CandidateListing[]): CandidateSource {
  const at = (c: CandidateListing, origin: LatLng) => ({ ...c, distance_km: distanceKm(origin, c.location) });
  return {
    inBox: async (materials, box, origin, maxUnitPrice) =>
      all.filter((c) => materials.includes(c.material) && inBox(c.location, box) && (maxUnitPrice === undefined || unitPrice(c) <= maxUnitPrice)).map((c) => at(c, origin)),
    cheapest: async (material, origin, radius_km, limit) => {
      const sorted = all.filter((c) => c.material === material).map((c) => at(c, origin)).sort((a, b) => unitPrice(a) - unitPrice(b));
      const read = sorted.slice(0, limit);
      return { rows: read.filter((c) => c.distance_km <= radius_km), last_unit_price: read.length === limit ? unitPrice(read[read.length - 1]) : null };
    },
  };
}

/** A random county of listings around `centre`, `km` across. */
export function randomCounty(seed: number, count: number, km: number, centre: LatLng = FERNHOLLOW): CandidateListing[] {
  const r = prng(seed);
  const pick = <T,>(xs: T[]) => xs[Math.floor(r() * xs.length)];
  return Array.from({ length: count }, (_, i) => {
    const location = { lat: centre.lat + ((r() - 0.5) * km) / 111.2, lng: centre.lng + ((r() - 0.5) * km) / 68.2 };
    const kind = pick(["leaves", "leaves", "cardboard", "cardboard", "straw", "worms"] as const);
    const max = pick([null, null, 2, 5]);
    const base = { id: `c${i}`, location, max_per_reservation: max, unit_mass_kg: null };
    if (kind === "leaves") return candidateListing(centre, { ...base, material: "leaves", unit: "bags", unit_size: 0.1136, available: 1 + Math.floor(r() * 10), price_cents: pick([0, 0, 0, 100]) });
    if (kind === "cardboard") return candidateListing(centre, { ...base, material: "cardboard", unit: "sheets", unit_size: pick([0.6, 0.8]), available: 5 + Math.floor(r() * 20), price_cents: 0 });
    if (kind === "straw") return candidateListing(centre, { ...base, material: "straw", unit: "bales", unit_size: 0.1487, unit_mass_kg: 20, available: 2 + Math.floor(r() * 10), price_cents: pick([300, 400, 500]) });
    return candidateListing(centre, { ...base, material: "worms", unit: "kg", unit_size: null, available: 1 + Math.floor(r() * 4), price_cents: pick([1800, 2400, 3000]) });
  });
}
