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

/**
 * The largest seam overlap, as a share of a sheet's shorter side. Past half, each sheet adds
 * less new ground than it hides under its neighbours, and tiny sheets with wide seams make
 * the grid (and the work of counting it) explode: a product limit, not a fact.
 */
export const MAX_OVERLAP_SHARE = 0.5;

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
  if (![sl, sw, o].every(Number.isFinite) || o < 0 || sl <= 0 || sw <= 0) {
    throw new RangeError("sheet sides and overlap must be finite, the sides positive");
  }
  if (o > MAX_OVERLAP_SHARE * Math.min(sl, sw) + 1e-12) {
    throw new RangeError("the overlap must be at most half of the sheet's shorter side");
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
 * - Polygon: see cardboardLayout; the count is the number of sheets it lays.
 */
export function cardboardFor(bed: CardboardBed, opts: CardboardOptions = {}): CardboardNeed {
  const { sl, sw, o } = resolveSheet(opts);
  let sheets: number;
  if ("polygon" in bed) {
    sheets = bestGrid(bed.polygon, sl, sw, o).count;
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

export interface CardboardLayout extends CardboardNeed {
  /** Each sheet as a closed lng/lat ring of its four corners. */
  sheet_rings: Position[][];
}

/**
 * Where each sheet of an outline's count goes. The outline is projected to local metres and
 * a grid of sheets is laid from one corner of its bounding box, lined up with its longest
 * edge: sheet i starts at i·(s − o) along each axis. Each sheet owns the cell from the far
 * edge of the sheet before it to its own far edge; the cells tile the plane and each lies
 * inside its sheet, so the sheets whose cells share ground with the outline cover it with
 * every seam overlapped, and no fewer of that grid would.
 *
 * The grid is tried from each of the four corners, with both ways of turning the sheets,
 * along every edge as long as the longest (to within rounding), and the fewest sheets win:
 * so the answer does not depend on which way the outline was drawn, where it starts, or
 * whether it is a mirror image.
 */
export function cardboardLayout(polygon: Polygon, opts: CardboardOptions = {}): CardboardLayout {
  const { sl, sw, o } = resolveSheet(opts);
  const best = bestGrid(polygon, sl, sw, o, true);
  return { sheets: best.count, area_m2: best.count * sl * sw, sheet_rings: best.rings ?? [] };
}

// --- polygon grid ------------------------------------------------------------------------

type XY = [number, number];

interface Frame {
  /** Local metres about the centroid → grid frame (rotated, then mirrored by sx, sy). */
  angle: number;
  sx: 1 | -1;
  sy: 1 | -1;
}

interface Grid {
  count: number;
  rings?: Position[][];
}

const FLIPS: [1 | -1, 1 | -1][] = [[1, 1], [-1, 1], [1, -1], [-1, -1]];

function bestGrid(geometry: Polygon, sl: number, sw: number, o: number, withRings = false): Grid {
  const { project, unproject } = localProjection(geometry);
  const local = geometry.coordinates.map((ring) => ring.slice(0, -1).map(project));
  let best: { count: number; frame: Frame; along: number; across: number; rings: XY[][] } | null = null;
  for (const angle of gridAngles(local[0])) {
    const c = Math.cos(-angle);
    const s = Math.sin(-angle);
    for (const [sx, sy] of FLIPS) {
      const rings = local.map((ring) => ring.map(([x, y]): XY => [sx * (x * c - y * s), sy * (x * s + y * c)]));
      for (const [along, across] of [[sl, sw], [sw, sl]]) {
        const count = countSheetsOverRings(rings, along, across, o);
        if (!best || count < best.count) best = { count, frame: { angle, sx, sy }, along, across, rings };
      }
    }
  }
  const b = best!;
  if (!withRings) return { count: b.count };
  const sheets = sheetsOverRings(b.rings, b.along, b.across, o);
  const c = Math.cos(b.frame.angle);
  const s = Math.sin(b.frame.angle);
  // Grid frame → local metres: undo the mirror, then the rotation.
  const back = ([gx, gy]: XY): Position => {
    const x = b.frame.sx * gx;
    const y = b.frame.sy * gy;
    return unproject([x * c - y * s, x * s + y * c]);
  };
  const rings = sheets.map(([x0, y0, x1, y1]) => {
    const corners = [back([x0, y0]), back([x1, y0]), back([x1, y1]), back([x0, y1])];
    return [...corners, corners[0]];
  });
  return { count: b.count, rings };
}

/**
 * Equirectangular projection about the centroid. Over a bed of at most a hectare the
 * distortion is far below a sheet's overlap.
 */
function localProjection(geometry: Polygon) {
  const { lat, lng } = polygonCentroid(geometry);
  const k = (Math.PI / 180) * EARTH_MEAN_RADIUS_M;
  const cosLat = Math.cos((lat * Math.PI) / 180);
  return {
    project: ([x, y]: Position): XY => [(x - lng) * k * cosLat, (y - lat) * k],
    unproject: ([x, y]: XY): Position => [lng + x / (k * cosLat), lat + y / k],
  };
}

// Two edges drawn as the same length can differ in the last bits once projected; within
// this share of the longest they count as equally long.
const SAME_LENGTH = 1e-6;
const SAME_ANGLE = 1e-9;
/**
 * A regular many-sided outline has as many longest edges as sides; past this many
 * directions the rest add work and, by its symmetry, no fewer sheets.
 */
const MAX_DIRECTIONS = 4;

/**
 * The directions (in [0, π)) of the outline's longest edges, farthest from the centre first
 * (a choice that does not depend on how the ring was drawn; the ring is about its centroid).
 */
function gridAngles(ring: XY[]): number[] {
  const edges = ring.map(([x1, y1], i) => {
    const [x2, y2] = ring[(i + 1) % ring.length];
    const angle = Math.atan2(y2 - y1, x2 - x1);
    return { len: Math.hypot(x2 - x1, y2 - y1), reach: Math.hypot(x1 + x2, y1 + y2), angle: ((angle % Math.PI) + Math.PI) % Math.PI };
  });
  const longest = Math.max(...edges.map((e) => e.len));
  const angles: number[] = [];
  for (const e of edges.filter((e) => e.len >= longest * (1 - SAME_LENGTH)).sort((a, b) => b.reach - a.reach)) {
    if (angles.length === MAX_DIRECTIONS) break;
    if (!angles.some((a) => Math.abs(a - e.angle) < SAME_ANGLE || Math.abs(Math.abs(a - e.angle) - Math.PI) < SAME_ANGLE)) angles.push(e.angle);
  }
  return angles;
}

/**
 * Counts the sheets whose cells share area with the outline (holes subtracted).
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
  let count = 0;
  scanCells(rings, sl, sw, o, (_r, n) => {
    count += n;
  }, false);
  return Math.max(1, count);
}

/** The sheets whose cells share area with the outline, as [x0, y0, x1, y1] in the grid frame. */
function sheetsOverRings(rings: XY[][], sl: number, sw: number, o: number): [number, number, number, number][] {
  const out: [number, number, number, number][] = [];
  const x0 = Math.min(...rings[0].map((p) => p[0]));
  const y0 = Math.min(...rings[0].map((p) => p[1]));
  scanCells(rings, sl, sw, o, (r, _n, cols) => {
    const y = y0 + r * (sw - o);
    for (const c of cols) {
      const x = x0 + c * (sl - o);
      out.push([x, y, x + sl, y + sw]);
    }
  });
  // A bed smaller than every cell test still takes one sheet, from the corner.
  if (out.length === 0) out.push([x0, y0, x0 + sl, y0 + sw]);
  return out;
}

/**
 * Walks the rows of the grid; for each row that meets the outline, calls back with the
 * number of cells that share area with it and, when asked for, which columns they are.
 */
function scanCells(rings: XY[][], sl: number, sw: number, o: number, onRow: (row: number, n: number, cols: number[]) => void, listCols = true): void {
  const xs = rings[0].map((p) => p[0]);
  const ys = rings[0].map((p) => p[1]);
  const cols = slabs(Math.min(...xs), Math.max(...xs), sl, o);
  const rows = slabs(Math.min(...ys), Math.max(...ys), sw, o);
  // A cell that only grazes the outline along an edge shares (numerically almost) no area.
  const minShared = 1e-9 * sl * sw;

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
  let next = 0;
  let active: Edge[] = [];
  const picked: number[] = [];
  for (let r = 0; r < rows.n; r++) {
    const ya = rows.lo(r);
    const yb = rows.hi(r);
    while (next < edges.length && edges[next].ylo < yb) active.push(edges[next++]);
    active = active.filter((e) => e.yhi > ya);
    if (active.length === 0) continue;
    picked.length = 0;
    const n = countRow(active, ya, yb, listCols ? picked : null);
    if (n > 0) onRow(r, n, picked);
  }
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
 * The sheets' cells along one axis over [start, end]. Sheet i covers
 * [start + i·p, start + i·p + sheet] with p = sheet − o, so its far edge is at
 * start + sheet + i·p; cell i runs from sheet i − 1's far edge to its own. n sheets are
 * enough when the last far edge reaches end: n = ceil((span − o)/p). In the layout the first
 * and last cells run out to infinity; here they stop one pitch past the outline, which lies
 * within [start, end], so no cell's shared area changes.
 */
function slabs(start: number, end: number, sheet: number, o: number): Slabs {
  const pitch = sheet - o;
  const n = sheetsAlong(end - start, sheet, o);
  const edge = (i: number) => start + sheet + i * pitch;
  return {
    n,
    lo: (i) => (i === 0 ? start - pitch : edge(i - 1)),
    hi: (i) => (i === n - 1 ? Math.max(end, edge(i)) + pitch : edge(i)),
    at: (v) => Math.min(n - 1, Math.max(0, Math.floor((v - start - sheet) / pitch) + 1)),
  };
}

/**
 * Counts the cells of one row (ya..yb) that share more than minShared with the outline, and
 * lists their columns when given a list. Scratch arrays are one per column and reused row
 * after row; only the columns a row touches are read and cleared.
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
  return (active: Edge[], ya: number, yb: number, list: number[] | null): number => {
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
      if (above > k && pitch * s > minShared) {
        count += above - k;
        if (list) for (let c = above; c > k; c--) list.push(c);
      }
      s += cover[k];
      if (exact[k] + (cols.hi(k) - cols.lo(k)) * s > minShared) {
        count++;
        list?.push(k);
      }
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
