// Matching without reading every listing in the radius. Each need is searched in a ring
// around the origin that starts small and grows:
//
// 1. until it holds a few times the need, in several listings (nearest first);
// 2. then a plan is made, and the cheapest listings within the whole radius (an index in
//    order of price per unit) join in, for the needs the plan pays for;
// 3. then the search widens while a listing could still serve a need for less than the need
//    costs in the plan now (its prices, its stops, the driving its stops add). A listing
//    d km from the origin and from every other stop adds about 2d km of driving on top of
//    a stop and a price no lower than buying from the cheapest listings, so it is worth a
//    look only within
//
//      d = (need's share of the plan − cheapest price − one stop) / (2 × cost per km)
//
//    of the origin or of one of the plan's other stops (where it would be on the way).
//    Those rings and neighbourhoods are read, and the plan is made again.
//
// The rule weighs one need at a time, as the local search in allocate does, and ignores a
// listing halfway along a long leg, so it is a heuristic like the rest; the benchmark
// compares its plans with a full scan's.
import { LISTING_UNITS } from "@/lib/calc/units";
import type { MaterialCode } from "@/lib/calc/facts";
import { allocate, buildOptions, type AllocationResult } from "./allocate";
import { purchase } from "./purchase";
import type { CostOptions } from "./defaults";
import { DEFAULT_VEHICLE } from "./defaults";
import { type Box, boundingBox } from "@/lib/geo/box";
import { distanceKm } from "./geo";
import { buildPlan, mergeNeeds, type PlanOptions, resolveCosts } from "./plan";
import { planTour } from "./tour";
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
  /**
   * Active listings of `materials` with something left whose public point is in `box`, and
   * when `maxUnitPrice` is given only those at most that price per unit size; distance_km
   * from `origin`.
   */
  inBox(materials: readonly MaterialCode[], box: Box, origin: LatLng, maxUnitPrice?: number): Promise<CandidateListing[]>;
  /** The same within `radius_km` of `origin`, cheapest per unit size first, at most `limit` of them. */
  cheapest(material: MaterialCode, origin: LatLng, radius_km: number, limit: number): Promise<CheapestRows>;
}

export interface SearchOptions extends PlanOptions {
  /** First ring, km. */
  start_km?: number;
}

export interface SearchStats {
  /** Queries made. */
  queries: number;
  candidates: number;
  /** Final ring around the origin per material, km. */
  rings: Partial<Record<MaterialCode, number>>;
}

// Search settings, tuned on the benchmark (a product choice, no source).
const START_KM = 0.5;
const SUPPLY_FACTOR = 3;
const MIN_LISTINGS = 6;
const CHEAPEST_LIMIT = 24;
const MAX_STEPS = 12;
/** Two boxes are read as one when the box around both is at most this much bigger. */
const MERGE_SLACK = 1.5;
/** Neighbourhoods smaller than this are not worth a query. */
const MIN_LOOK_KM = 0.1;
/** The least a ring grows by in one step of the widening search, km. */
const STEP_KM = 2;
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

/**
 * The price of buying `need` from the cheapest listings in the radius alone (whole units
 * where they come whole, any shortfall at the least price of the listings not read), and
 * the least price per need unit among them: what a far listing would have to beat.
 */
export function cheapestPrice(need: Need, cheapest: CheapestRows): { cents: number; least_ppu: number } {
  const options = buildOptions([need], cheapest.rows);
  const unseen = cheapest.last_unit_price === null ? Infinity : cheapest.last_unit_price * unitPriceFactor(need.material, need.unit);
  const bought = purchase(options, need.quantity, 0);
  const left = need.quantity - bought.covered;
  const cents = left > EPS && Number.isFinite(unseen) ? bought.price + left * unseen : bought.price;
  return { cents, least_ppu: Math.min(unseen, ...options.map((o) => o.ppu)) };
}

/** What need `i` costs in the plan: its prices, its stops, and the driving its stops add. */
function needShare(result: AllocationResult, candidates: readonly CandidateListing[], origin: LatLng, i: number, costs: CostOptions) {
  const own = result.picks.filter((p) => p.option.need === i);
  const others = result.picks.filter((p) => p.option.need !== i).map((p) => candidates[p.option.cand]);
  const without = planTour(origin, others.map((c) => c.location)).length_km;
  return {
    cents: own.reduce((s, p) => s + p.units * p.option.price, 0) + costs.cost_per_stop_cents * own.length + costs.cost_per_km_cents * Math.max(0, result.tour_km - without),
    others,
  };
}

interface Disk {
  centre: LatLng;
  km: number;
  /** Only listings at most this price per unit size (Infinity: all). */
  cap: number;
}

const area = (b: Box) => (b.maxLat - b.minLat) * (b.maxLng - b.minLng);
const union = (a: Box, b: Box): Box => ({
  minLat: Math.min(a.minLat, b.minLat),
  maxLat: Math.max(a.maxLat, b.maxLat),
  minLng: Math.min(a.minLng, b.minLng),
  maxLng: Math.max(a.maxLng, b.maxLng),
});

/** The disks' boxes, joined wherever one query over both reads little more than two would. */
export function mergeBoxes(disks: readonly Disk[]): Box[] {
  const boxes = disks.map((d) => ({ box: boundingBox(d.centre, d.km), area: 0 })).map((b) => ({ ...b, area: area(b.box) }));
  for (let joined = true; joined && boxes.length > 1; ) {
    joined = false;
    outer: for (let a = 0; a < boxes.length; a++) {
      for (let b = a + 1; b < boxes.length; b++) {
        const u = union(boxes[a].box, boxes[b].box);
        if (area(u) <= MERGE_SLACK * (boxes[a].area + boxes[b].area)) {
          boxes[a] = { box: u, area: boxes[a].area + boxes[b].area };
          boxes.splice(b, 1);
          joined = true;
          break outer;
        }
      }
    }
  }
  return boxes.map((b) => b.box);
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
  const pool = new Map<string, CandidateListing>();
  const searched = merged.map((): Disk[] => []);
  const ring = merged.map(() => 0);
  const cheapestFor = new Map<number, { cents: number; least_ppu: number }>();
  let queries = 0;

  /** Read the parts of these disks not read before, for need i. */
  const read = async (i: number, disks: Disk[]) => {
    const fresh = disks
      .map((d) => ({ ...d, km: Math.min(d.km, radius_km + distanceKm(origin, d.centre)) }))
      .filter((d) => d.km >= MIN_LOOK_KM && !searched[i].some((s) => s.cap >= d.cap && distanceKm(s.centre, d.centre) + d.km <= s.km + EPS));
    if (!fresh.length) return false;
    let found = false;
    const cap = Math.max(...fresh.map((d) => d.cap));
    for (const box of mergeBoxes(fresh)) {
      queries++;
      for (const c of await source.inBox([merged[i].material], box, origin, Number.isFinite(cap) ? cap : undefined)) {
        if (c.distance_km > radius_km || pool.has(c.id)) continue;
        pool.set(c.id, c);
        found = true;
      }
    }
    searched[i].push(...fresh);
    return found;
  };
  /** Grow the rings of needs `idx` to `km` around the origin, in one query for them all. */
  const widen = async (idx: number[], km: number) => {
    const r = Math.min(radius_km, km);
    queries++;
    for (const c of await source.inBox(idx.map((i) => merged[i].material), boundingBox(origin, r), origin)) {
      if (c.distance_km <= radius_km) pool.set(c.id, c);
    }
    for (const i of idx) {
      ring[i] = r;
      searched[i].push({ centre: origin, km: r, cap: Infinity });
    }
  };

  // 1. Rings that hold a few times each need, in several listings. Needs still short grow
  //    together, aiming straight for the ring that should hold enough (listings grow with
  //    the area), so a sparse county takes a few queries, not a few per need.
  let short = merged.map((_, i) => i);
  await widen(short, opts.start_km ?? START_KM);
  for (let step = 0; step < MAX_STEPS && short.length; step++) {
    const candidates = [...pool.values()];
    let grow = 0;
    short = short.filter((i) => {
      const n = merged[i];
      if (ring[i] >= radius_km) return false;
      const options = buildOptions([n], candidates);
      const supply = options.reduce((s, o) => s + o.supply, 0);
      if (supply >= SUPPLY_FACTOR * n.quantity && options.length >= MIN_LISTINGS) return false;
      const lack = Math.max((SUPPLY_FACTOR * n.quantity) / Math.max(supply, EPS), MIN_LISTINGS / Math.max(options.length, EPS));
      grow = Math.max(grow, Math.min(4, Math.max(1.5, 1.2 * Math.sqrt(lack))));
      return true;
    });
    if (short.length) await widen(short, Math.max(...short.map((i) => ring[i])) * grow);
  }

  let planned = [...pool.values()];
  let result = allocate(merged, planned, origin, costs, opts.warm);
  const replan = () => {
    const warm = result.picks.map((p) => planned[p.option.cand].id);
    planned = [...pool.values()];
    result = allocate(merged, planned, origin, costs, warm);
  };

  for (let step = 0; step < MAX_STEPS; step++) {
    // 2. The cheapest listings in the radius, for the needs the plan pays for; the slack
    //    below is only worth measuring on a plan that has seen them.
    let joined = false;
    for (let i = 0; i < merged.length; i++) {
      if (cheapestFor.has(i) || !result.picks.some((p) => p.option.need === i && p.option.price > 0)) continue;
      const cheap = await source.cheapest(merged[i].material, origin, radius_km, CHEAPEST_LIMIT);
      queries++;
      cheapestFor.set(i, cheapestPrice(merged[i], cheap));
      for (const c of cheap.rows) {
        if (!pool.has(c.id)) joined = true;
        pool.set(c.id, c);
      }
    }
    if (joined) replan();

    // 3. Look again, around the origin and around the plan's other stops, as far as a
    //    listing could still serve a need for less than it costs now. A listing that
    //    covers x of the need at p a unit, the rest bought at the least price p₀, saves
    //    nothing unless x(p − p₀) < slack: so only p < p₀ + slack / quantity is read.
    let found = false;
    let pending = false;
    for (let i = 0; i < merged.length; i++) {
      if (result.covered[i] <= EPS) continue;
      const share = needShare(result, planned, origin, i, costs);
      const floor = cheapestFor.get(i);
      const slack = share.cents - (floor?.cents ?? 0) - costs.cost_per_stop_cents;
      if (slack <= EPS) continue;
      const reach = costs.cost_per_km_cents > 0 ? Math.min(radius_km, slack / (2 * costs.cost_per_km_cents)) : radius_km;
      // At most double each step: what turns up nearer usually shrinks the slack, and
      // with it how far there is left to look.
      const km = Math.min(reach, Math.max(2 * ring[i], STEP_KM));
      if (km < reach - EPS) pending = true;
      const factor = unitPriceFactor(merged[i].material, merged[i].unit);
      const cap = floor && floor.cents > 0 && factor > 0 ? (floor.least_ppu + slack / merged[i].quantity) / factor : Infinity;
      if (km > ring[i]) ring[i] = km;
      const disks = [{ centre: origin, km: ring[i], cap }, ...share.others.map((o) => ({ centre: o.location, km, cap }))];
      if (await read(i, disks)) found = true;
    }
    if (!found && !pending) break;
    if (found) replan();
  }

  return {
    plan: buildPlan(merged, planned, origin, result, costs, vehicle),
    stats: { queries, candidates: planned.length, rings: Object.fromEntries(merged.map((n, i) => [n.material, Math.round(ring[i] * 1000) / 1000])) },
  };
}
