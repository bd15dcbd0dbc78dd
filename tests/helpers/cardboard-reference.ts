// The polygon sheet count as first written: every cell of the outline's bounding-box grid
// is clipped against the outline. Far too slow for a long thin outline (it was the cause of
// ten-second estimates), but plain enough to trust, so the unit tests check the faster count
// in lib/calc/cardboard.ts against it on many small shapes.
import type { Polygon, Position } from "geojson";
import { polygonCentroid } from "@/lib/calc/area";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";
import { ceilWhole } from "@/lib/calc/numbers";

type XY = [number, number];

const ceilCount = (x: number) => Math.max(1, ceilWhole(x));
const sheetsAlong = (span: number, sheet: number, overlap: number) => ceilCount((span - overlap) / (sheet - overlap));

export function referencePolygonSheets(
  geometry: Polygon,
  opts: { sheet_length_m?: number; sheet_width_m?: number; overlap_cm?: number } = {},
): number {
  const sl = opts.sheet_length_m ?? DEFAULT_CARDBOARD_SHEET.length_m;
  const sw = opts.sheet_width_m ?? DEFAULT_CARDBOARD_SHEET.width_m;
  const o = (opts.overlap_cm ?? CARDBOARD_OVERLAP_CM.default) / 100;
  const rings = projectToLocalMetres(geometry);
  return Math.min(countSheetsOverRings(rings, sl, sw, o), countSheetsOverRings(rings, sw, sl, o));
}

function projectToLocalMetres(geometry: Polygon): XY[][] {
  const { lat, lng } = polygonCentroid(geometry);
  const k = Math.PI / 180;
  const cosLat = Math.cos(lat * k);
  const toXY = ([x, y]: Position): XY => [
    (x - lng) * k * EARTH_MEAN_RADIUS_M * cosLat,
    (y - lat) * k * EARTH_MEAN_RADIUS_M,
  ];
  const rings = geometry.coordinates.map((ring) => ring.slice(0, -1).map(toXY));
  const angle = longestEdgeAngle(rings[0]);
  const c = Math.cos(-angle);
  const s = Math.sin(-angle);
  return rings.map((ring) => ring.map(([x, y]): XY => [x * c - y * s, x * s + y * c]));
}

function longestEdgeAngle(ring: XY[]): number {
  let best = 0;
  let angle = 0;
  ring.forEach(([x1, y1], i) => {
    const [x2, y2] = ring[(i + 1) % ring.length];
    const len = Math.hypot(x2 - x1, y2 - y1);
    if (len > best) {
      best = len;
      angle = Math.atan2(y2 - y1, x2 - x1);
    }
  });
  return angle;
}

/**
 * Sheets of sl (along x) × sw from the outline's lower-left corner, sheet i starting at
 * i·(sl − o). Each sheet is given the slab between the right edge of the sheet before it and
 * its own right edge; the slabs tile the plane and each lies inside its sheet, so counting
 * the slabs that share area with the outline counts exactly the sheets needed. On a
 * rectangle this gives the same count as sheetsAlong.
 */
function countSheetsOverRings(rings: XY[][], sl: number, sw: number, o: number): number {
  const xs = rings[0].map((p) => p[0]);
  const ys = rings[0].map((p) => p[1]);
  const x0 = Math.min(...xs);
  const y0 = Math.min(...ys);
  const cols = sheetsAlong(Math.max(...xs) - x0, sl, o);
  const rows = sheetsAlong(Math.max(...ys) - y0, sw, o);
  // The first and last slabs run out to infinity so rounding at the outline's extremes
  // cannot leave a sliver uncounted.
  const slab = (start: number, pitch: number, i: number, n: number): [number, number] => [
    i === 0 ? -Infinity : start + o + (i - 1) * pitch,
    i === n - 1 ? Infinity : start + o + i * pitch,
  ];
  // A slab that only grazes the outline along an edge shares (numerically almost) no area.
  const minShared = 1e-6 * sl * sw;
  let count = 0;
  for (let r = 0; r < rows; r++) {
    const [ya, yb] = slab(y0, sw - o, r, rows);
    const band = rings.map((ring) => clip(ring, 1, ya, yb));
    for (let c = 0; c < cols; c++) {
      const [xa, xb] = slab(x0, sl - o, c, cols);
      const [outer, ...holes] = band.map((ring) => Math.abs(shoelace(clip(ring, 0, xa, xb))));
      const shared = outer - holes.reduce((a, b) => a + b, 0);
      if (shared > minShared) count++;
    }
  }
  return Math.max(1, count);
}

/** Sutherland–Hodgman clip of a ring to lo ≤ p[axis] ≤ hi; fine for concave rings against a convex slab. */
function clip(ring: XY[], axis: 0 | 1, lo: number, hi: number): XY[] {
  return clipHalf(clipHalf(ring, axis, lo, 1), axis, hi, -1);
}

function clipHalf(ring: XY[], axis: 0 | 1, bound: number, side: 1 | -1): XY[] {
  const inside = (p: XY) => side * (p[axis] - bound) >= 0;
  const out: XY[] = [];
  ring.forEach((cur, i) => {
    const prev = ring[(i + ring.length - 1) % ring.length];
    if (inside(cur) !== inside(prev)) {
      const t = (bound - prev[axis]) / (cur[axis] - prev[axis]);
      out.push([prev[0] + t * (cur[0] - prev[0]), prev[1] + t * (cur[1] - prev[1])]);
    }
    if (inside(cur)) out.push(cur);
  });
  return out;
}

function shoelace(ring: XY[]): number {
  let sum = 0;
  ring.forEach(([x1, y1], i) => {
    const [x2, y2] = ring[(i + 1) % ring.length];
    sum += x1 * y2 - x2 * y1;
  });
  return sum / 2;
}
