// Which listings to visit and how much to take from each, minimising
//   price + cost_per_km × length of the visiting loop + cost_per_stop × (stops − 1)
// while covering as much of every need as the listings can. A greedy start (cheapest
// insertion, per unit of need covered) is improved by local search: drop a stop, swap one
// listing for another of the same material, or add one that lowers the price.
import { WHOLE_UNITS } from "@/lib/calc/units";
import type { CostOptions } from "./defaults";
import { distanceKm } from "./geo";
import { type Option, type Purchase, purchase } from "./purchase";
import { planTourOnMatrix, type Matrix } from "./tour";
import type { CandidateListing, LatLng, Need } from "./types";
import { needPerListingUnit } from "./units";
import { wholePacks } from "@/lib/listings/packs";

export type { Option };

export interface Pick {
  option: Option;
  units: number;
}

export interface AllocationResult {
  /** In visiting order. */
  picks: Pick[];
  /** Per need, in the need's unit. */
  covered: number[];
  tour_km: number;
  price_cents: number;
  travel_cents: number;
  stop_cents: number;
  cost_cents: number;
}

const EPS = 1e-9;

/** Every (listing, need) pair that can serve: same material, comparable units, something left. */
export function buildOptions(needs: readonly Need[], candidates: readonly CandidateListing[]): Option[] {
  const byMaterial = new Map(needs.map((n, i) => [n.material, i] as const));
  const options: Option[] = [];
  candidates.forEach((c, cand) => {
    const need = byMaterial.get(c.material);
    if (need === undefined) return;
    const y = needPerListingUnit(c, needs[need].unit);
    if (!y) return;
    const limit = Math.min(c.available, c.max_per_reservation ?? Infinity);
    // A listing sold by the pack is bought in whole packs at the pack price.
    const pack = c.pack ?? null;
    const whole = pack !== null || WHOLE_UNITS.has(c.unit);
    const step = pack ? pack.size : 1;
    const per = pack ? y * pack.size : y;
    const price = pack ? pack.price_cents : c.price_cents;
    const cap = pack ? wholePacks(limit, pack) : whole ? Math.floor(limit + EPS) : limit;
    if (!(cap > EPS)) return;
    options.push({ cand, need, yield: per, whole, step, cap, price, ppu: price / per, supply: cap * per, distance_km: c.distance_km });
  });
  return options;
}

// How many listings per need local search looks at. The rest are dominated in practice: far
// away, dear, and small all at once.
const POOL_BY_SCORE = 8;
const POOL_NEAREST = 3;
const POOL_CHEAPEST = 3;
const POOL_LARGEST = 2;

/** The options worth searching for one need, always holding enough to cover what can be covered. */
function poolFor(options: Option[], quantity: number, costs: CostOptions): Option[] {
  // Cost of covering the need from this listing alone, per whole need covered.
  const alone = (o: Option) => {
    const share = Math.min(quantity, o.supply);
    return (o.ppu * share + 2 * o.distance_km * costs.cost_per_km_cents + costs.cost_per_stop_cents) / (share / quantity);
  };
  const scored = options.map((o) => ({ o, s: alone(o) })).sort((a, b) => a.s - b.s);
  const picked = new Set<Option>();
  const take = (list: Option[], n: number) => list.slice(0, n).forEach((o) => picked.add(o));
  take(scored.map((x) => x.o), POOL_BY_SCORE);
  take([...options].sort((a, b) => a.distance_km - b.distance_km), POOL_NEAREST);
  take([...options].sort((a, b) => a.ppu - b.ppu || a.distance_km - b.distance_km), POOL_CHEAPEST);
  take([...options].sort((a, b) => b.supply - a.supply), POOL_LARGEST);
  let supply = [...picked].reduce((s, o) => s + o.supply, 0);
  for (const { o } of scored) {
    if (supply >= quantity - EPS) break;
    if (!picked.has(o)) {
      picked.add(o);
      supply += o.supply;
    }
  }
  return [...picked];
}

export function allocate(
  needs: readonly Need[],
  candidates: readonly CandidateListing[],
  origin: LatLng,
  costs: CostOptions,
  warm: readonly string[] = [],
): AllocationResult {
  const all = buildOptions(needs, candidates);
  const pools = needs.map((n, i) => poolFor(all.filter((o) => o.need === i), n.quantity, costs));
  const pool = pools.flat();
  const targets = needs.map((n, i) => Math.min(n.quantity, pools[i].reduce((s, o) => s + o.supply, 0)));

  // Distances between pool members (node 0 is the origin), worked out when first asked for.
  const nodes = [origin, ...pool.map((o) => candidates[o.cand].location)];
  const size = nodes.length;
  const dist = new Float64Array(size * size).fill(-1);
  const d = (a: number, b: number) => {
    if (a === b) return 0;
    const k = a * size + b;
    if (dist[k] < 0) dist[k] = dist[b * size + a] = distanceKm(nodes[a], nodes[b]);
    return dist[k];
  };
  const node = new Map(pool.map((o, i) => [o, i + 1] as const));

  const memo = new Map<string, Purchase>();
  // Memoised per set of listings; units come back in node order, whatever order was asked.
  const byNode = (a: Option, b: Option) => node.get(a)! - node.get(b)!;
  const buy = (need: number, chosen: Option[]): { options: Option[]; p: Purchase } => {
    const options = [...chosen].sort(byNode);
    const key = `${need}:${options.map((o) => node.get(o)).join(",")}`;
    let p = memo.get(key);
    if (!p) {
      p = purchase(options, needs[need].quantity, costs.cost_per_stop_cents);
      memo.set(key, p);
    }
    return { options, p };
  };

  interface State {
    set: Set<Option>;
    picks: Pick[];
    covered: number[];
    tour: number[];
    tour_km: number;
    price: number;
    cost: number;
  }

  const evaluate = (set: Set<Option>): State => {
    const picks: Pick[] = [];
    const covered = needs.map(() => 0);
    let price = 0;
    needs.forEach((_, i) => {
      const chosen = [...set].filter((o) => o.need === i);
      if (!chosen.length) return;
      const { options, p } = buy(i, chosen);
      covered[i] = p.covered;
      price += p.price;
      options.forEach((o, j) => p.units[j] > 0 && picks.push({ option: o, units: p.units[j] }));
    });
    const ids = [0, ...picks.map((p) => node.get(p.option)!)];
    const m: Matrix = ids.map((a) => ids.map((b) => d(a, b)));
    const tour = planTourOnMatrix(m);
    const stops = picks.length;
    const cost = price + costs.cost_per_km_cents * tour.length_km + costs.cost_per_stop_cents * Math.max(0, stops - 1);
    return { set, picks: tour.order.map((j) => picks[j]), covered, tour: tour.order, tour_km: tour.length_km, price, cost };
  };

  const complete = (s: State) => s.covered.every((c, i) => c >= targets[i] - EPS);
  const coverage = (s: State) => s.covered.reduce((sum, c, i) => sum + (needs[i].quantity > 0 ? c / needs[i].quantity : 0), 0);

  // Greedy: add the listing with the least extra cost per share of a need it newly covers.
  // Its extra driving is estimated by cheapest insertion into the current loop.
  let state = evaluate(new Set(pool.filter((o) => warm.includes(candidates[o.cand].id))));
  while (!complete(state)) {
    const loop = [0, ...state.picks.map((p) => node.get(p.option)!), 0];
    let best: { o: Option; score: number } | null = null;
    for (const o of pool) {
      if (state.set.has(o) || state.covered[o.need] >= targets[o.need] - EPS) continue;
      const n = node.get(o)!;
      let insert = Infinity;
      for (let k = 0; k < loop.length - 1; k++) insert = Math.min(insert, d(loop[k], n) + d(n, loop[k + 1]) - d(loop[k], loop[k + 1]));
      const chosen = [...state.set].filter((x) => x.need === o.need);
      const before = buy(o.need, chosen).p;
      const after = buy(o.need, [...chosen, o]).p;
      const gain = (after.covered - before.covered) / needs[o.need].quantity;
      if (gain <= EPS) continue;
      const extra = after.price - before.price + costs.cost_per_km_cents * insert + (state.picks.length ? costs.cost_per_stop_cents : 0);
      const score = extra / gain;
      if (!best || score < best.score) best = { o, score };
    }
    if (!best) break;
    state = evaluate(new Set([...state.set, best.o]));
  }

  // Local search: take any move that keeps coverage and lowers the cost, until none does.
  const better = (a: State, b: State) => coverage(a) > coverage(b) + EPS || (coverage(a) >= coverage(b) - EPS && a.cost < b.cost - 1e-6);
  for (let round = 0; round < 50; round++) {
    let moved = false;
    const members = [...state.set];
    for (const o of members) {
      const without = new Set(state.set);
      without.delete(o);
      const tries: Set<Option>[] = [without];
      for (const alt of pools[o.need]) if (!state.set.has(alt)) tries.push(new Set([...without, alt]));
      for (const t of tries) {
        const next = evaluate(t);
        if (better(next, state)) {
          state = next;
          moved = true;
          break;
        }
      }
      if (moved) break;
    }
    if (!moved) {
      for (const o of pool) {
        if (state.set.has(o)) continue;
        const next = evaluate(new Set([...state.set, o]));
        if (better(next, state)) {
          state = next;
          moved = true;
          break;
        }
      }
    }
    if (!moved) break;
  }

  // Listings the purchase left at zero units are not stops.
  const final = evaluate(new Set(state.picks.map((p) => p.option)));
  return {
    picks: final.picks,
    covered: final.covered,
    tour_km: final.tour_km,
    price_cents: final.price,
    travel_cents: costs.cost_per_km_cents * final.tour_km,
    stop_cents: costs.cost_per_stop_cents * Math.max(0, final.picks.length - 1),
    cost_cents: final.cost,
  };
}
