// How much to take from each of a given set of listings for one need: the cheapest way to
// cover it, counting a stop for every listing used. Sheets, bags and bales come whole, so
// this is a small covering knapsack; the sets it sees hold a handful of listings, so a
// depth-first search with a node budget solves it exactly in practice.
import { MEASURE_STEP } from "./units";

export interface Option {
  /** Index of the candidate listing. */
  cand: number;
  /** Index of the need it serves. */
  need: number;
  /** Need units one unit of this option covers. */
  yield: number;
  whole: boolean;
  /**
   * Listing units in one unit of this option: 1, or a pack's size for a listing sold by the
   * pack, whose option counts whole packs.
   */
  step: number;
  /** Units it may give: what is left, capped by the per-reservation maximum. */
  cap: number;
  /** Cents per unit of this option. */
  price: number;
  /** Cents per need unit. */
  ppu: number;
  /** cap × yield. */
  supply: number;
  distance_km: number;
}

export interface Purchase {
  /** Listing units from each option, in the order given. */
  units: number[];
  covered: number;
  price: number;
  used: number;
}

const EPS = 1e-9;
const NODE_BUDGET = 4000;

/** Loose material is measured out in MEASURE_STEP, rounded up, never past what is left. */
export function measuredTake(o: Option, remaining: number): number {
  const exact = remaining / o.yield;
  const stepped = Math.ceil(exact / MEASURE_STEP - EPS) * MEASURE_STEP;
  return Math.min(o.cap, Number(stepped.toFixed(6)));
}

/**
 * Cover `quantity` from `options`: as much as they can hold, then the least price plus
 * `stopCents` per listing used, then the least left over.
 */
export function purchase(options: readonly Option[], quantity: number, stopCents: number): Purchase {
  const idx = options.map((_, i) => i).sort((a, b) => options[a].ppu - options[b].ppu || options[b].supply - options[a].supply);
  // supplyFrom[k]: what the options from position k on can still give.
  const supplyFrom = new Array<number>(idx.length + 1).fill(0);
  for (let k = idx.length - 1; k >= 0; k--) supplyFrom[k] = supplyFrom[k + 1] + options[idx[k]].supply;
  const target = Math.min(quantity, supplyFrom[0]);
  const units = new Array<number>(options.length).fill(0);
  type Best = { units: number[]; covered: number; score: number; excess: number };
  const s: { best: Best | null } = { best: null };
  let nodes = 0;

  const consider = (covered: number, score: number) => {
    const excess = Math.max(0, covered - quantity);
    const best = s.best;
    if (best) {
      const full = covered >= target - EPS;
      const bestFull = best.covered >= target - EPS;
      if (bestFull && !full) return;
      if (full === bestFull) {
        if (!full && covered <= best.covered + EPS) return;
        if (full && (score > best.score + EPS || (score >= best.score - EPS && excess >= best.excess - EPS))) return;
      }
    }
    s.best = { units: [...units], covered, score, excess };
  };

  const dfs = (k: number, covered: number, score: number) => {
    nodes++;
    const remaining = quantity - covered;
    if (remaining <= EPS || k === idx.length) return consider(covered, score);
    const best = s.best;
    if (best && best.covered >= target - EPS) {
      // Finishing needs at least one more listing, at o.ppu a unit or dearer.
      if (covered + supplyFrom[k] < target - EPS) return;
      if (score + stopCents + Math.min(remaining, target - covered) * options[idx[k]].ppu > best.score + EPS) return;
    }
    const o = options[idx[k]];
    const most = o.whole ? Math.min(Math.floor(o.cap + EPS), Math.ceil(remaining / o.yield - EPS)) : measuredTake(o, remaining);
    const tries = o.whole ? Array.from({ length: most + 1 }, (_, i) => most - i) : most > 0 ? [most, 0] : [0];
    for (const u of tries) {
      if (nodes > NODE_BUDGET && s.best) break;
      units[idx[k]] = u;
      dfs(k + 1, covered + u * o.yield, score + u * o.price + (u > 0 ? stopCents : 0));
    }
    units[idx[k]] = 0;
  };
  dfs(0, 0, 0);

  const best = s.best as Best;
  const chosen = best.units;
  return {
    units: chosen,
    covered: Math.min(quantity, best.covered),
    price: chosen.reduce((s, u, i) => s + u * options[i].price, 0),
    used: chosen.filter((u) => u > 0).length,
  };
}
