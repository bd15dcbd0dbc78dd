import {
  area as turfArea,
  bbox,
  booleanPointInPolygon,
  centerOfMass,
  kinks,
  lineIntersect,
  lineString,
  polygon as turfPolygon,
} from "@turf/turf";
import type { Polygon, Position } from "geojson";
import { EARTH_MEAN_RADIUS_M } from "./facts";
import { assertPositiveFinite } from "./numbers";

export type { Polygon, Position };

export function rectangleArea(length_m: number, width_m: number): number {
  assertPositiveFinite("length_m", length_m);
  assertPositiveFinite("width_m", width_m);
  return length_m * width_m;
}

/** Area in m² of a GeoJSON polygon in lng/lat (holes subtracted), on Turf's spherical Earth. */
export function polygonArea(geometry: Polygon): number {
  return turfArea(geometry);
}

/** Centre of mass of the polygon's shape, for the bed's latitude and map pin. */
export function polygonCentroid(geometry: Polygon): { lat: number; lng: number } {
  const [lng, lat] = centerOfMass(geometry).geometry.coordinates;
  return { lat, lng };
}

/**
 * The longer side, in metres, of the outline's latitude/longitude bounding box: north–south
 * along a meridian, east–west along the box's middle latitude (Turf's sphere). How far a
 * bed spreads, whatever its area.
 */
export function polygonSpan(geometry: Polygon): number {
  const [west, south, east, north] = bbox(geometry);
  const k = (Math.PI / 180) * EARTH_MEAN_RADIUS_M;
  const midLat = ((south + north) / 2) * (Math.PI / 180);
  return Math.max((north - south) * k, (east - west) * k * Math.cos(midLat));
}

function isLngLat(p: Position): boolean {
  return (
    Array.isArray(p) &&
    (p.length === 2 || p.length === 3) &&
    p.every((v) => typeof v === "number" && Number.isFinite(v)) &&
    Math.abs(p[0]) <= 180 &&
    Math.abs(p[1]) <= 90
  );
}

/**
 * A linear ring a bed outline can use: at least four positions, closed (first equals last),
 * every position a finite lng/lat in range, and no edge crossing another. Zero-area rings
 * (all points on one line) are rejected too, since no bed has no area.
 */
export function isValidRing(ring: readonly Position[]): boolean {
  if (!Array.isArray(ring) || ring.length < 4 || !ring.every(isLngLat)) return false;
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first[0] !== last[0] || first[1] !== last[1]) return false;
  const geometry = turfPolygon([ring as Position[]]).geometry;
  if (kinks(geometry).features.length > 0) return false;
  return turfArea(geometry) > 0;
}

/** Where an outline's rings go wrong, and how to say so; null when the polygon is usable. */
export interface PolygonProblem {
  /** Index of the ring at fault, or null for the polygon as a whole. */
  ring: number | null;
  message: string;
}

const HOLE_OUTSIDE = "A hole must lie inside the outline without touching or crossing it";
const HOLES_OVERLAP = "Holes must not overlap, touch or lie inside each other";

type Box = [number, number, number, number];
const boxOf = (ring: Position[]) => bbox(lineString(ring)) as Box;
const boxesMeet = (a: Box, b: Box) => a[0] <= b[2] && b[0] <= a[2] && a[1] <= b[3] && b[1] <= a[3];
/** Any shared point between two rings' edges: a crossing, a touch or a shared stretch. */
const ringsMeet = (a: Position[], b: Position[]) => lineIntersect(lineString(a), lineString(b)).features.length > 0;
const inside = (p: Position, ring: Position[]) => booleanPointInPolygon(p, turfPolygon([ring]));

/**
 * Every ring valid (isValidRing), every hole strictly inside the outline and apart from the
 * other holes, and some ground left over. Checked ring against ring with Turf's sweep-line
 * intersection, so the cost grows with pairs of rings, not pairs of points.
 */
export function polygonProblem(geometry: Polygon): PolygonProblem | null {
  const rings = geometry.coordinates;
  const bad = rings.findIndex((ring) => !isValidRing(ring));
  if (bad >= 0) return { ring: bad, message: "The outline must be closed and must not cross itself" };
  const [outer, ...holes] = rings;
  const outerBox = boxOf(outer);
  const boxes = holes.map(boxOf);
  for (const [i, hole] of holes.entries()) {
    // With no shared point, a hole is wholly inside or wholly outside, so one corner tells.
    const within = boxesMeet(boxes[i], outerBox) && !ringsMeet(outer, hole) && inside(hole[0], outer);
    if (!within) return { ring: i + 1, message: HOLE_OUTSIDE };
  }
  for (let i = 0; i < holes.length; i++) {
    for (let j = i + 1; j < holes.length; j++) {
      if (!boxesMeet(boxes[i], boxes[j])) continue;
      if (ringsMeet(holes[i], holes[j]) || inside(holes[i][0], holes[j]) || inside(holes[j][0], holes[i])) {
        return { ring: j + 1, message: HOLES_OVERLAP };
      }
    }
  }
  if (!(polygonArea(geometry) > 0)) return { ring: null, message: "The outline must enclose some ground" };
  return null;
}
