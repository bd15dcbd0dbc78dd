// The visiting order: nearest neighbour from the origin, then 2-opt until no swap of two
// legs shortens the loop. The loop always starts and ends at the origin.
import { distanceKm } from "./geo";
import type { LatLng } from "./types";

/** Distances between nodes 0 (the origin) … n (the stops). */
export type Matrix = number[][];

export function distanceMatrix(origin: LatLng, points: readonly LatLng[]): Matrix {
  const all = [origin, ...points];
  const m: Matrix = all.map(() => new Array<number>(all.length).fill(0));
  for (let i = 0; i < all.length; i++) {
    for (let j = i + 1; j < all.length; j++) m[i][j] = m[j][i] = distanceKm(all[i], all[j]);
  }
  return m;
}

/** Stops 1…n in the order nearest neighbour visits them from node 0. */
export function nearestNeighbourOrder(m: Matrix): number[] {
  const n = m.length - 1;
  const left = new Set<number>();
  for (let i = 1; i <= n; i++) left.add(i);
  const order: number[] = [];
  let at = 0;
  while (left.size) {
    let best = -1;
    let bestD = Infinity;
    for (const j of left) {
      if (m[at][j] < bestD) {
        bestD = m[at][j];
        best = j;
      }
    }
    order.push(best);
    left.delete(best);
    at = best;
  }
  return order;
}

/** Length of the loop 0 → order… → 0. */
export function loopLength(m: Matrix, order: readonly number[]): number {
  let total = 0;
  let at = 0;
  for (const j of order) {
    total += m[at][j];
    at = j;
  }
  return total + m[at][0];
}

// A swap has to gain more than rounding noise, or two equal tours could swap forever.
const GAIN = 1e-10;

/** 2-opt: reverse any run of stops whose reversal shortens the loop, until none does. */
export function twoOpt(m: Matrix, order: readonly number[]): number[] {
  const route = [0, ...order, 0];
  const last = route.length - 1;
  let improved = true;
  while (improved) {
    improved = false;
    for (let i = 0; i < last - 1; i++) {
      for (let j = i + 2; j < last; j++) {
        const a = route[i];
        const b = route[i + 1];
        const c = route[j];
        const d = route[j + 1];
        if (m[a][c] + m[b][d] < m[a][b] + m[c][d] - GAIN) {
          for (let lo = i + 1, hi = j; lo < hi; lo++, hi--) [route[lo], route[hi]] = [route[hi], route[lo]];
          improved = true;
        }
      }
    }
  }
  return route.slice(1, last);
}

export interface Tour {
  /** Indices into the points given, in visiting order. */
  order: number[];
  length_km: number;
}

export function planTourOnMatrix(m: Matrix): Tour {
  const order = twoOpt(m, nearestNeighbourOrder(m));
  return { order: order.map((j) => j - 1), length_km: loopLength(m, order) };
}

export function planTour(origin: LatLng, points: readonly LatLng[]): Tour {
  return planTourOnMatrix(distanceMatrix(origin, points));
}
