// An independent check of a cardboard layout: the actual sheet rectangles, and a fine grid
// of points inside the outline, each of which must lie under at least one sheet. It shares
// no code with lib/calc/cardboard.ts beyond the layout it is handed: Turf decides what is
// inside the outline, and a point is under a sheet when it is on the inner side of all
// four of the sheet's edges (the test is affine, so lng/lat serve as well as metres).
import { bbox, booleanPointInPolygon, destination, point } from "@turf/turf";
import type { Polygon, Position } from "geojson";

/** A polygon drawn in metres (x east, y north) about a point, turned by `turn` radians. */
export function polygonFromMetres(xy: [number, number][], turn = 0, lat = 51.5, lng = -0.1): Polygon {
  const origin = point([lng, lat]);
  const ring = xy.map(([x, y]) => {
    const xr = x * Math.cos(turn) - y * Math.sin(turn);
    const yr = x * Math.sin(turn) + y * Math.cos(turn);
    const d = Math.hypot(xr, yr);
    if (d === 0) return [lng, lat];
    return destination(origin, d / 1000, 90 - (Math.atan2(yr, xr) * 180) / Math.PI).geometry.coordinates;
  });
  return { type: "Polygon", coordinates: [[...ring, ring[0]]] };
}

function underSheet(p: Position, ring: Position[]): boolean {
  // The ring's corners in order, closed; inside a convex quad = same side of every edge.
  let sign = 0;
  for (let i = 0; i < 4; i++) {
    const [ax, ay] = ring[i];
    const [bx, by] = ring[i + 1];
    const cross = (bx - ax) * (p[1] - ay) - (by - ay) * (p[0] - ax);
    if (cross === 0) continue; // on the edge counts as under
    const s = Math.sign(cross);
    if (sign === 0) sign = s;
    else if (s !== sign) return false;
  }
  return true;
}

/**
 * Points of a grid `step_m` apart (at most about `maxPoints` of them) that lie inside the
 * outline (holes excluded) but under no sheet.
 */
export function uncoveredPoints(polygon: Polygon, sheetRings: Position[][], step_m: number, maxPoints = 40_000): Position[] {
  const [west, south, east, north] = bbox(polygon);
  const lat = (south + north) / 2;
  const mPerDegLat = 111_195; // a degree on Turf's sphere, near enough for spacing a grid
  const mPerDegLng = mPerDegLat * Math.cos((lat * Math.PI) / 180);
  const widthM = (east - west) * mPerDegLng;
  const heightM = (north - south) * mPerDegLat;
  const step = Math.max(step_m, Math.sqrt((widthM * heightM) / maxPoints));
  // Index the sheets by a coarse grid of their bounding boxes, so each point tests a few.
  const boxes = sheetRings.map((r) => bbox({ type: "Polygon", coordinates: [r] }));
  const bucketDeg = Math.max(...boxes.map(([w, s, e, n]) => Math.max(e - w, n - s)));
  const buckets = new Map<string, number[]>();
  boxes.forEach(([w, s, e, n], i) => {
    for (let bx = Math.floor(w / bucketDeg); bx <= Math.floor(e / bucketDeg); bx++) {
      for (let by = Math.floor(s / bucketDeg); by <= Math.floor(n / bucketDeg); by++) {
        const key = `${bx}:${by}`;
        if (!buckets.has(key)) buckets.set(key, []);
        buckets.get(key)!.push(i);
      }
    }
  });
  const missed: Position[] = [];
  // Offset by a third of a step so the grid does not sit on the outline's own vertices.
  for (let y = step / 3; y < heightM; y += step) {
    for (let x = step / 3; x < widthM; x += step) {
      const p: Position = [west + x / mPerDegLng, south + y / mPerDegLat];
      if (!booleanPointInPolygon(p, polygon, { ignoreBoundary: true })) continue;
      const near = buckets.get(`${Math.floor(p[0] / bucketDeg)}:${Math.floor(p[1] / bucketDeg)}`) ?? [];
      if (!near.some((i) => underSheet(p, sheetRings[i]))) missed.push(p);
    }
  }
  return missed;
}
