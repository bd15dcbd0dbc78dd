// Matching without reading every listing in the radius. Each material is searched in a
// ring that starts small and doubles. Once the rings hold enough to cover every need, a
// plan is made from what they hold, and a ring only grows further if a listing outside it
// could still beat that plan:
//
//   any plan that visits a listing outside a ring of r km drives at least 2r km (there and
//   back), and pays at least the cheapest price anyone within the radius asks for each
//   need, so it costs at least  2r × cost_per_km + Σ price floors + a stop per need.
//
// When that floor is no lower than the plan in hand, nothing outside the ring can win, and
// the search stops. The price floors come from the cheapest listings within the whole
// radius (an index ordered by price per unit), which also join the candidates.
import type { MaterialCode } from "@/lib/calc/facts";
import { allocate, buildOptions, type AllocationResult } from "./allocate";
import { DEFAULT_VEHICLE } from "./defaults";
import { buildPlan, mergeNeeds, type PlanOptions, resolveCosts } from "./plan";
import type { Vehicle } from "./trips";
import type { CandidateListing, LatLng, ListingUnit, MatchPlan, Need, NeedUnit } from "./types";
import { needPerListingUnit } from "./units";

export interface CheapestRows {
  /** Listings within the radius, in ascending order of price per unit size. */
  rows: CandidateListing[];
  /**
   * Price per unit size (price_cents ÷ unit_size for sheets, bags and bales, price_cents
   * otherwise) of the last row the query read, when it stopped at its limit; null when it
   * read every listing there is. Nothing it did not read is cheaper than this.
   */
  last_unit_price: number | null;
}

/** Where candidates come from: the database, or an array in tests and benchmarks. */
export interface CandidateSource {
  /** Active listings of `material` with something left, within `radius_km` of `origin`. */
  within(material: MaterialCode, origin: LatLng, radius_km: number): Promise<CandidateListing[]>;
  /** The same, cheapest per unit size first, at most `limit` of them. */
  cheapest(material: MaterialCode, origin: LatLng, radius_km: number, limit: number): Promise<CheapestRows>;
}

export interface SearchOptions extends PlanOptions {
  /** First ring, km. */
  start_km?: number;
}

export interface SearchStats {
  rounds: number;
  candidates: number;
  /** Final ring per material, km. */
  rings: Partial<Record<MaterialCode, number>>;
}

const LISTING_UNITS: ListingUnit[] = ["sheets", "m2", "bags", "m3", "bales", "kg"];
const START_KM = 2;
const CHEAPEST_LIMIT = 24;
const MAX_ROUNDS = 40;
const EPS = 1e-6;

/**
 * The least (price per need unit) ÷ (price per unit size) any listing of this material can
 * have, so that a floor on the second is a floor on the first. Zero when a bale's stated
 * weight, not its size, says how much it holds: then size says nothing about price.
 */
export function unitPriceFactor(material: MaterialCode, unit: NeedUnit): number {
  let least = Infinity;
  for (const u of LISTING_UNITS) {
    for (const size of [null, 1]) {
      const y = needPerListingUnit({ material, unit: u, unit_size: size, unit_mass_kg: null }, unit);
      if (!y) continue;
      const byMass = needPerListingUnit({ material, unit: u, unit_size: size, unit_mass_kg: 1000 }, unit);
      least = Math.min(least, byMass !== y ? 0 : (size ?? 1) / y);
    }
  }
  return Number.isFinite(least) ? least : 0;
}

/** The least anyone could pay for `need` from the listings in the radius (a fractional fill). */
export function priceFloor(need: Need, cheapest: CheapestRows): number {
  const options = buildOptions([need], cheapest.rows).sort((a, b) => a.ppu - b.ppu);
  const unseen = cheapest.last_unit_price === null ? Infinity : cheapest.last_unit_price * unitPriceFactor(need.material, need.unit);
  let left = need.quantity;
  let floor = 0;
  for (const o of options) {
    if (left <= 0 || o.ppu >= unseen) break;
    const take = Math.min(left, o.supply);
    floor += take * o.ppu;
    left -= take;
  }
  return left > 0 && Number.isFinite(unseen) ? floor + left * unseen : floor;
}

export async function searchPlan(
  needs: readonly Need[],
  origin: LatLng,
  radius_km: number,
  source: CandidateSource,
  opts: SearchOptions = {},
): Promise<{ plan: MatchPlan; stats: SearchStats }> {
  const merged = mergeNeeds(needs);
  const costs = resolveCosts(opts.costs);
  const vehicle = { ...DEFAULT_VEHICLE, ...Object.fromEntries(Object.entries(opts.vehicle ?? {}).filter(([, v]) => v !== undefined)) } as Vehicle;
  const start = Math.min(radius_km, opts.start_km ?? START_KM);
  const ring = merged.map(() => start);
  const fetched = merged.map(() => 0);
  const pool = new Map<string, CandidateListing>();
  const floors = new Map<number, number>();
  let result: AllocationResult | null = null;
  let candidates: CandidateListing[] = [];
  // The candidates `result` indexes into (the pool may have grown since).
  let planned: CandidateListing[] = [];
  let warm: readonly string[] = opts.warm ?? [];
  let rounds = 0;

  const grow = (i: number) => (ring[i] = Math.min(radius_km, ring[i] * 2));

  while (rounds++ < MAX_ROUNDS) {
    for (let i = 0; i < merged.length; i++) {
      if (ring[i] <= fetched[i]) continue;
      for (const c of await source.within(merged[i].material, origin, ring[i])) pool.set(c.id, c);
      fetched[i] = ring[i];
    }
    candidates = [...pool.values()];

    // A ring that cannot yet cover its need grows before any plan is made.
    let short = false;
    merged.forEach((n, i) => {
      const supply = buildOptions([n], candidates).reduce((s, o) => s + o.supply, 0);
      if (supply < n.quantity - EPS && ring[i] < radius_km) {
        grow(i);
        short = true;
      }
    });
    if (short) continue;

    result = allocate(merged, candidates, origin, costs, warm);
    planned = candidates;
    warm = result.picks.map((p) => candidates[p.option.cand].id);

    // Price floors for the needs this plan pays for; the cheap listings found join the pool.
    let joined = false;
    const spend = merged.map(() => 0);
    for (const p of result.picks) spend[p.option.need] += p.units * p.option.price;
    for (let i = 0; i < merged.length; i++) {
      if (spend[i] <= 0 || floors.has(i)) continue;
      const cheap = await source.cheapest(merged[i].material, origin, radius_km, CHEAPEST_LIMIT);
      floors.set(i, priceFloor(merged[i], cheap));
      for (const c of cheap.rows) {
        if (!pool.has(c.id)) {
          pool.set(c.id, c);
          joined = true;
        }
      }
    }
    if (joined) continue;

    const served = result.covered.filter((c) => c > EPS).length;
    const floor = [...floors.entries()].reduce((s, [i, f]) => s + (spend[i] > 0 ? f : 0), 0) + costs.cost_per_stop_cents * Math.max(0, served - 1);
    let grew = false;
    for (let i = 0; i < merged.length; i++) {
      if (ring[i] < radius_km && 2 * ring[i] * costs.cost_per_km_cents + floor < result.cost_cents - EPS) {
        grow(i);
        grew = true;
      }
    }
    if (!grew) break;
  }

  if (!result) {
    result = allocate(merged, candidates, origin, costs, warm);
    planned = candidates;
  }
  return {
    plan: buildPlan(merged, planned, origin, result, costs, vehicle),
    stats: { rounds, candidates: candidates.length, rings: Object.fromEntries(merged.map((n, i) => [n.material, ring[i]])) },
  };
}
