import type { Polygon, Position } from "geojson";
import { polygonCentroid } from "./area";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, EARTH_MEAN_RADIUS_M } from "./facts";
import { countSheetsOverRings, sheetsAlong, sheetsOverRings, type XY } from "./cardboard-grid";
import { assertPositiveFinite } from "./numbers";

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
