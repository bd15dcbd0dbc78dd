import type { Polygon, Position } from "geojson";
import { polygonCentroid } from "./area";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, EARTH_MEAN_RADIUS_M } from "./facts";
import { assertPositiveFinite, ceilWhole } from "./numbers";

export type CardboardBed = { length_m: number; width_m: number } | { area_m2: number } | { polygon: Polygon };

export interface CardboardOptions {
  sheet_length_m?: number;
  sheet_width_m?: number;
  overlap_cm?: number;
}

export interface CardboardNeed {
  sheets: number;
  /** Cardboard laid, overlaps and trimmed edges included: sheets × sheet area, never less than the bed. */
  area_m2: number;
}

// Even a bed smaller than the overlap takes one sheet.
const ceilCount = (x: number) => Math.max(1, ceilWhole(x));

/** Sheets of `sheet` length laid in a row, each overlapping the last by `overlap`, to span `span`. */
function sheetsAlong(span: number, sheet: number, overlap: number): number {
  return ceilCount((span - overlap) / (sheet - overlap));
}

function resolveSheet(opts: CardboardOptions) {
  const sl = opts.sheet_length_m ?? DEFAULT_CARDBOARD_SHEET.length_m;
  const sw = opts.sheet_width_m ?? DEFAULT_CARDBOARD_SHEET.width_m;
  const o = (opts.overlap_cm ?? CARDBOARD_OVERLAP_CM.default) / 100;
  if (![sl, sw, o].every(Number.isFinite) || o < 0 || sl <= o || sw <= o) {
    throw new RangeError("each sheet side must be finite and longer than the overlap");
  }
  return { sl, sw, o };
}

/**
 * One layer of sheets in a grid, every seam overlapped. Both ways of turning the sheets are
 * tried and the one needing fewer sheets wins.
 *
 * - Rectangle: sheets along = ceil((L − o)/(sl − o)), likewise across.
 * - Area only: the bed is taken to be a square of that area — an assumption that errs a
 *   little low for long thin beds, so pass the sides when they are known.
 * - Polygon: projected to local metres, the grid is lined up with the outline's longest
 *   edge, and every sheet whose un-overlapped part touches the outline is counted. Those
 *   parts tile the plane, so the sheets counted always cover the bed.
 */
export function cardboardFor(bed: CardboardBed, opts: CardboardOptions = {}): CardboardNeed {
  const { sl, sw, o } = resolveSheet(opts);
  let sheets: number;
  if ("polygon" in bed) {
    const rings = projectToLocalMetres(bed.polygon);
    sheets = Math.min(countSheetsOverRings(rings, sl, sw, o), countSheetsOverRings(rings, sw, sl, o));
  } else {
    const [L, W] = "area_m2" in bed ? [Math.sqrt(bed.area_m2), Math.sqrt(bed.area_m2)] : [bed.length_m, bed.width_m];
    assertPositiveFinite("bed length", L);
    assertPositiveFinite("bed width", W);
    sheets = Math.min(
      sheetsAlong(L, sl, o) * sheetsAlong(W, sw, o),
      sheetsAlong(L, sw, o) * sheetsAlong(W, sl, o),
    );
  }
  return { sheets, area_m2: sheets * sl * sw };
}

// --- polygon grid ------------------------------------------------------------------------

type XY = [number, number];

/**
 * Equirectangular projection about the centroid, rotated so the longest edge of the outer
 * ring runs along x. Over a bed of at most a hectare the distortion is far below a sheet's
 * overlap.
 */
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
 * i·(sl − o). Each sheet is given the cell between the far edges of the sheets before it
 * and its own far edges; the cells tile the plane and each lies inside its sheet, so
 * counting the cells that share area with the outline counts exactly the sheets needed. On
 * a rectangle this gives the same count as sheetsAlong.
 *
 * The area a cell shares with the outline comes from Green's theorem: it is the sum over the
 * outline's edges of ∫ (clamp(x, xa, xb) − xa) dy, taken over the part of each edge inside
 * the cell's row. An edge adds its own term only to the few cells its x-extent spans; to
 * every cell wholly left of it, it adds (xb − xa)·dy. So each row is walked from edge to
 * edge, and the cells between (wholly inside or wholly outside the outline) are counted in
 * one step. The work grows with the edges and the cells they cross, not with the bounding
 * box: a long thin L costs no more than its outline.
 */
function countSheetsOverRings(rings: XY[][], sl: number, sw: number, o: number): number {
  const xs = rings[0].map((p) => p[0]);
  const ys = rings[0].map((p) => p[1]);
  const cols = slabs(Math.min(...xs), Math.max(...xs), sl, o);
  const rows = slabs(Math.min(...ys), Math.max(...ys), sw, o);
  // A cell that only grazes the outline along an edge shares (numerically almost) no area.
  const minShared = 1e-6 * sl * sw;

  // Weighted so the outline counts positive and holes negative, whichever way each was drawn.
  const edges: Edge[] = [];
  rings.forEach((ring, r) => {
    const w = (r === 0 ? 1 : -1) * Math.sign(shoelace(ring));
    ring.forEach(([ax, ay], i) => {
      const [bx, by] = ring[(i + 1) % ring.length];
      // A level edge has no dy, so it adds nothing to any cell.
      if (ay !== by && w !== 0) edges.push({ ax, ay, bx, by, w, ylo: Math.min(ay, by), yhi: Math.max(ay, by) });
    });
  });
  edges.sort((a, b) => a.ylo - b.ylo);

  const countRow = rowCounter(cols, minShared);
  let count = 0;
  let next = 0;
  let active: Edge[] = [];
  for (let r = 0; r < rows.n; r++) {
    const ya = rows.lo(r);
    const yb = rows.hi(r);
    while (next < edges.length && edges[next].ylo < yb) active.push(edges[next++]);
    active = active.filter((e) => e.yhi > ya);
    if (active.length > 0) count += countRow(active, ya, yb);
  }
  return Math.max(1, count);
}

interface Edge {
  ax: number;
  ay: number;
  bx: number;
  by: number;
  /** +1 or −1: the sign that makes the ring's enclosed area count the right way. */
  w: number;
  ylo: number;
  yhi: number;
}

interface Slabs {
  n: number;
  lo: (i: number) => number;
  hi: (i: number) => number;
  /** The slab holding v (rounding may be one off; callers widen by one). */
  at: (v: number) => number;
}

/**
 * The sheets' slabs along one axis over [start, end]: slab i runs from the far edge of sheet
 * i − 1 to the far edge of sheet i. In the layout the first and last run out to infinity;
 * here they stop one pitch past the outline, which lies within [start, end], so no cell's
 * shared area changes.
 */
function slabs(start: number, end: number, sheet: number, o: number): Slabs {
  const pitch = sheet - o;
  const n = sheetsAlong(end - start, sheet, o);
  return {
    n,
    lo: (i) => (i === 0 ? start - pitch : start + o + (i - 1) * pitch),
    hi: (i) => (i === n - 1 ? end + pitch : start + o + i * pitch),
    at: (v) => Math.min(n - 1, Math.max(0, Math.floor((v - start - o) / pitch) + 1)),
  };
}

/**
 * Counts the cells of one row (ya..yb) that share more than minShared with the outline.
 * Scratch arrays are one per column and reused row after row; only the columns a row
 * touches are read and cleared.
 */
function rowCounter(cols: Slabs, minShared: number) {
  const exact = new Float64Array(cols.n);
  // cover[k]: dy that every column at or left of k gets, times its width.
  const cover = new Float64Array(cols.n);
  const seen = new Uint8Array(cols.n);
  const keys: number[] = [];
  const pitch = cols.n > 2 ? cols.hi(1) - cols.lo(1) : 0;
  const touch = (c: number) => {
    if (!seen[c]) {
      seen[c] = 1;
      keys.push(c);
    }
  };
  return (active: Edge[], ya: number, yb: number): number => {
    touch(0);
    touch(cols.n - 1);
    for (const e of active) {
      const span = e.by - e.ay;
      const ta = Math.min(1, Math.max(0, (ya - e.ay) / span));
      const tb = Math.min(1, Math.max(0, (yb - e.ay) / span));
      const t0 = Math.min(ta, tb);
      const t1 = Math.max(ta, tb);
      const dy = (t1 - t0) * span * e.w;
      if (dy === 0) continue;
      const u = e.ax + t0 * (e.bx - e.ax);
      const v = e.ax + t1 * (e.bx - e.ax);
      const c0 = Math.max(0, cols.at(Math.min(u, v)) - 1);
      const c1 = Math.min(cols.n - 1, cols.at(Math.max(u, v)) + 1);
      for (let c = c0; c <= c1; c++) {
        exact[c] += dy * meanClampedOffset(u, v, cols.lo(c), cols.hi(c));
        touch(c);
      }
      if (c0 > 0) {
        cover[c0 - 1] += dy;
        touch(c0 - 1);
      }
    }
    // Walk right to left. Between two touched columns the cover is the same, and every
    // such column is one pitch wide (the first and last columns are always touched).
    keys.sort((a, b) => b - a);
    let s = 0;
    let above = cols.n - 1;
    let count = 0;
    for (const k of keys) {
      if (above > k && pitch * s > minShared) count += above - k;
      s += cover[k];
      if (exact[k] + (cols.hi(k) - cols.lo(k)) * s > minShared) count++;
      above = k - 1;
      exact[k] = 0;
      cover[k] = 0;
      seen[k] = 0;
    }
    keys.length = 0;
    return count;
  };
}

/** Mean of clamp(x, a, b) − a for x running evenly from u to v. */
function meanClampedOffset(u: number, v: number, a: number, b: number): number {
  const [p, q] = u < v ? [u, v] : [v, u];
  if (p === q) return Math.min(b, Math.max(a, p)) - a;
  let sum = 0;
  const m0 = Math.max(p, a);
  const m1 = Math.min(q, b);
  if (m1 > m0) sum += ((m0 - a + (m1 - a)) / 2) * (m1 - m0);
  const r0 = Math.max(p, b);
  if (q > r0) sum += (b - a) * (q - r0);
  return sum / (q - p);
}

function shoelace(ring: XY[]): number {
  let sum = 0;
  ring.forEach(([x1, y1], i) => {
    const [x2, y2] = ring[(i + 1) % ring.length];
    sum += x1 * y2 - x2 * y1;
  });
  return sum / 2;
}
