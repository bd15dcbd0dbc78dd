// Splitting the pickups into carloads. A stop bigger than the car gets trips of its own
// (whole sheets, bags and bales are never split); the rest are cut into trips along the
// visiting order at the points that keep the driving shortest (route first, cluster second).
import { distanceKm } from "./geo";
import type { LatLng, Trip } from "./types";

export interface Vehicle {
  load_l: number;
  load_kg: number;
}

export interface StopLoad {
  listing_id: string;
  location: LatLng;
  units: number;
  whole: boolean;
  /** Per listing unit. */
  unit_l: number;
  unit_kg: number;
}

export interface TripPlan {
  trips: Trip[];
  distance_km: number;
  /** Listings with a single item that does not fit the car on its own. */
  oversize: string[];
}

const EPS = 1e-9;

/** Listing units of one stop that fit in one empty car. */
function unitsPerLoad(s: StopLoad, v: Vehicle): number {
  const byL = s.unit_l > 0 ? v.load_l / s.unit_l : Infinity;
  const byKg = s.unit_kg > 0 ? v.load_kg / s.unit_kg : Infinity;
  const n = Math.min(byL, byKg);
  return s.whole ? Math.floor(n + EPS) : n;
}

interface Piece {
  stop: StopLoad;
  units: number;
}

const loadOf = (p: Piece) => ({ l: p.units * p.stop.unit_l, kg: p.units * p.stop.unit_kg });

function trip(origin: LatLng, pieces: Piece[]): Trip {
  let at = origin;
  let km = 0;
  let l = 0;
  let kg = 0;
  for (const p of pieces) {
    km += distanceKm(at, p.stop.location);
    at = p.stop.location;
    const load = loadOf(p);
    l += load.l;
    kg += load.kg;
  }
  km += distanceKm(at, origin);
  return { stops: pieces.map((p) => p.stop.listing_id), load_l: round(l, 1), load_kg: round(kg, 1), distance_km: round(km, 3) };
}

const round = (x: number, places: number) => Math.round(x * 10 ** places) / 10 ** places;

export function splitTrips(origin: LatLng, stops: readonly StopLoad[], vehicle: Vehicle): TripPlan {
  const oversize: string[] = [];
  const dedicated: Piece[][] = [];
  const rest: Piece[] = [];
  for (const s of stops) {
    let per = unitsPerLoad(s, vehicle);
    if (per <= EPS) {
      // One item is more than the car takes: it still has to travel, one at a time.
      oversize.push(s.listing_id);
      per = s.whole ? 1 : s.units;
    }
    let left = s.units;
    while (left > per + EPS) {
      dedicated.push([{ stop: s, units: per }]);
      left -= per;
    }
    if (left > EPS) rest.push({ stop: s, units: s.whole ? Math.round(left) : round(left, 6) });
  }

  // best[j]: shortest driving that carries rest[0..j); cut[j]: where its last trip starts.
  const n = rest.length;
  const best = new Array<number>(n + 1).fill(Infinity);
  const cut = new Array<number>(n + 1).fill(0);
  best[0] = 0;
  for (let i = 0; i < n; i++) {
    let l = 0;
    let kg = 0;
    let legs = 0;
    for (let j = i; j < n; j++) {
      const load = loadOf(rest[j]);
      l += load.l;
      kg += load.kg;
      if (j > i && (l > vehicle.load_l + EPS || kg > vehicle.load_kg + EPS)) break;
      if (j > i) legs += distanceKm(rest[j - 1].stop.location, rest[j].stop.location);
      const km = distanceKm(origin, rest[i].stop.location) + legs + distanceKm(rest[j].stop.location, origin);
      if (best[i] + km < best[j + 1] - EPS) {
        best[j + 1] = best[i] + km;
        cut[j + 1] = i;
      }
    }
  }
  const loops: Piece[][] = [];
  for (let j = n; j > 0; j = cut[j]) loops.unshift(rest.slice(cut[j], j));

  const trips = [...dedicated, ...loops].map((pieces) => trip(origin, pieces));
  return { trips, distance_km: round(trips.reduce((s, t) => s + t.distance_km, 0), 3), oversize };
}
