// The grid of sheets over an outline in local metres: which sheets' cells share ground with
// it, counted row by row. Used by lib/calc/cardboard.ts, which chooses the grid's frame.
import { ceilWhole } from "./numbers";

export type XY = [number, number];

// Even a bed smaller than the overlap takes one sheet.
const ceilCount = (x: number) => Math.max(1, ceilWhole(x));

/** Sheets of `sheet` length laid in a row, each overlapping the last by `overlap`, to span `span`. */
export function sheetsAlong(span: number, sheet: number, overlap: number): number {
  return ceilCount((span - overlap) / (sheet - overlap));
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
export function countSheetsOverRings(rings: XY[][], sl: number, sw: number, o: number): number {
  let count = 0;
  scanCells(rings, sl, sw, o, (_r, n) => {
    count += n;
  }, false);
  return Math.max(1, count);
}

/** The sheets whose cells share area with the outline, as [x0, y0, x1, y1] in the grid frame. */
export function sheetsOverRings(rings: XY[][], sl: number, sw: number, o: number): [number, number, number, number][] {
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
