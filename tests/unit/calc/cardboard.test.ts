import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { destination, point } from "@turf/turf";
import type { Polygon } from "geojson";
import { polygonArea } from "@/lib/calc/area";
import { cardboardFor } from "@/lib/calc/cardboard";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";
import { referencePolygonSheets } from "../../helpers/cardboard-reference";

/** A polygon drawn in metres (x east, y north) about a point, turned by `turn` radians. */
function polygonFromMetres(xy: [number, number][], turn = 0, lat = 51.5, lng = -0.1): Polygon {
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

describe("cardboardFor a rectangle", () => {
  it("overlaps seams by about 6 in by default (common practice)", () => {
    expect(CARDBOARD_OVERLAP_CM.default / 2.54).toBeCloseTo(6, 0); // 15 cm = 5.9 in
  });

  it("lays the 4 × 2 m example in 15 sheets of 1.0 × 0.8 m", () => {
    // By hand, overlap 0.15 m. Long side of the sheet along the bed:
    //   along 4 m: ceil((4 − 0.15)/(1.0 − 0.15)) = ceil(4.53) = 5; across 2 m: ceil(1.85/0.65) = ceil(2.85) = 3 → 15.
    // Turned the other way: ceil(3.85/0.65) = 6 × ceil(1.85/0.85) = 3 → 18. Fewer wins.
    const r = cardboardFor({ length_m: 4, width_m: 2 });
    expect(r.sheets).toBe(15);
    expect(r.area_m2).toBeCloseTo(15 * 0.8, 10);
  });

  it("needs one sheet when the bed is no bigger than a sheet", () => {
    expect(cardboardFor({ length_m: 1, width_m: 0.8 }).sheets).toBe(1);
    expect(cardboardFor({ length_m: 0.3, width_m: 0.2 }).sheets).toBe(1);
  });

  it("does not add a sheet for floating-point dust on an exact fit", () => {
    // 3 sheets of 1.0 m with two 0.15 m seams span exactly 2.7 m; 2 sheets of 0.8 m span 1.45 m.
    expect(cardboardFor({ length_m: 2.7, width_m: 1.45 }).sheets).toBe(6);
  });

  it("takes sheet size and overlap from the options", () => {
    // 3 × 3 m with 1.2 × 1.2 m sheets and 0.3 m seams: ceil(2.7/0.9) = 3 each way → 9 sheets, 12.96 m².
    const r = cardboardFor({ length_m: 3, width_m: 3 }, { sheet_length_m: 1.2, sheet_width_m: 1.2, overlap_cm: 30 });
    expect(r.sheets).toBe(9);
    expect(r.area_m2).toBeCloseTo(12.96, 10);
  });

  it("treats an area alone as a square", () => {
    // 16 m² → 4 × 4 m: ceil(3.85/0.85) = 5 by ceil(3.85/0.65) = 6 → 30 sheets.
    expect(cardboardFor({ area_m2: 16 }).sheets).toBe(30);
  });

  it("rejects a sheet no longer than its overlap, and a bed with no size", () => {
    expect(() => cardboardFor({ length_m: 2, width_m: 2 }, { sheet_width_m: 0.1, overlap_cm: 15 })).toThrow(RangeError);
    expect(() => cardboardFor({ length_m: 0, width_m: 2 })).toThrow(RangeError);
  });
});

describe("cardboardFor a polygon", () => {
  it.each([0, 0.5, 1.2, 2.9])("counts a 4 × 2 m rectangle turned %s rad the same as the rectangle (15 sheets)", (turn) => {
    const bed = polygonFromMetres([[0, 0], [4, 0], [4, 2], [0, 2]], turn);
    expect(cardboardFor({ polygon: bed }).sheets).toBe(15);
  });

  it("needs fewer sheets for an L than for its bounding box", () => {
    // A 4 × 4 m square with a 2 × 2 m corner cut out; the square alone takes 30 sheets.
    const bed = polygonFromMetres([[0, 0], [4, 0], [4, 2], [2, 2], [2, 4], [0, 4]]);
    const r = cardboardFor({ polygon: bed });
    expect(r.sheets).toBeLessThan(30);
    expect(r.area_m2).toBeGreaterThanOrEqual(polygonArea(bed));
  });

  it("skips sheets over a hole", () => {
    const outer = polygonFromMetres([[0, 0], [10, 0], [10, 10], [0, 10]]);
    const hole = polygonFromMetres([[3, 3], [3, 7], [7, 7], [7, 3]]).coordinates[0];
    const withHole: Polygon = { type: "Polygon", coordinates: [outer.coordinates[0], hole] };
    expect(cardboardFor({ polygon: withHole }).sheets).toBeLessThan(cardboardFor({ polygon: outer }).sheets);
  });
});

describe("cardboardFor a long thin outline", () => {
  it("counts an L with 4 m wide arms 1,200 m and 1,000 m long by its arms, not its bounding box", () => {
    // Drawn on the equator, where a degree is the same length both ways, so the local
    // projection keeps the L's right angles; the 1,200 m edge is the longest, so the grid
    // lines up with it and starts at the L's outer corner. By hand, 1.0 × 0.8 m sheets,
    // 0.15 m seams; cell i along an axis ends at 0.15 + i × pitch:
    //   long side along x (pitch 0.85 × 0.65): columns ceil(1199.85/0.85) = 1412, rows
    //     ceil(999.85/0.65) = 1539; the arm along x (y ≤ 4) meets rows 0–6 (row 6 ends at
    //     4.05), the arm along y (x ≤ 4) meets columns 0–5 (column 5 ends at 4.40):
    //     7 × 1412 + 6 × 1539 − 7 × 6 = 19,076.
    //   turned (pitch 0.65 × 0.85): 6 × ceil(1199.85/0.65) + 7 × ceil(999.85/0.85) − 42
    //     = 6 × 1846 + 7 × 1177 − 42 = 19,273. Fewer wins.
    const k = (Math.PI / 180) * EARTH_MEAN_RADIUS_M;
    const xy = [[0, 0], [1200, 0], [1200, 4], [4, 4], [4, 1000], [0, 1000], [0, 0]];
    const bed: Polygon = { type: "Polygon", coordinates: [xy.map(([x, y]) => [10 + x / k, y / k])] };
    expect(cardboardFor({ polygon: bed }).sheets).toBe(19_076);
  });
});

describe("cardboard properties (fast-check)", () => {
  const sheet = fc.record({
    sheet_length_m: fc.double({ min: 0.35, max: 3, noNaN: true }),
    sheet_width_m: fc.double({ min: 0.35, max: 3, noNaN: true }),
    overlap_cm: fc.double({ min: 10, max: 30, noNaN: true }),
  });

  it("cardboard area is never less than the rectangle's area", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 100, noNaN: true }), fc.double({ min: 0.05, max: 100, noNaN: true }), sheet, (l, w, opts) => {
        const r = cardboardFor({ length_m: l, width_m: w }, opts);
        expect(Number.isInteger(r.sheets) && r.sheets >= 1).toBe(true);
        expect(r.area_m2).toBeGreaterThanOrEqual(l * w);
      }),
    );
  });

  it("cardboard area is never less than a star-shaped outline's area", () => {
    const star = fc.array(fc.double({ min: 1, max: 15, noNaN: true }), { minLength: 3, maxLength: 12 });
    fc.assert(
      fc.property(star, fc.double({ min: -60, max: 60, noNaN: true }), sheet, (radii, lat, opts) => {
        const xy = radii.map((r, i): [number, number] => {
          const a = (2 * Math.PI * i) / radii.length;
          return [r * Math.cos(a), r * Math.sin(a)];
        });
        const bed = polygonFromMetres(xy, 0, lat, 10);
        expect(cardboardFor({ polygon: bed }, opts).area_m2).toBeGreaterThanOrEqual(polygonArea(bed));
      }),
      { numRuns: 60 },
    );
  });

  it("counts every outline exactly as clipping each cell of the grid does", () => {
    // The reference clips the outline against every cell of its bounding-box grid (the
    // first way this was written); the fast count must agree sheet for sheet, holes included.
    const star = fc.array(fc.double({ min: 1, max: 12, noNaN: true }), { minLength: 3, maxLength: 14 });
    const hole = fc.option(fc.record({ r: fc.double({ min: 0.2, max: 0.9, noNaN: true }), n: fc.integer({ min: 3, max: 7 }) }));
    fc.assert(
      fc.property(star, hole, fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }), sheet, (radii, h, turn, lat, opts) => {
        const xy = radii.map((r, i): [number, number] => {
          const a = (2 * Math.PI * i) / radii.length;
          return [r * Math.cos(a), r * Math.sin(a)];
        });
        const bed = polygonFromMetres(xy, turn, lat, 10);
        if (h) {
          // A small regular polygon about the centre, inside the star's smallest radius.
          const r = h.r * Math.min(...radii) * Math.cos(Math.PI / radii.length);
          const ring = Array.from({ length: h.n }, (_, i): [number, number] => [r * Math.cos((2 * Math.PI * i) / h.n), r * Math.sin((2 * Math.PI * i) / h.n)]);
          bed.coordinates.push(polygonFromMetres(ring, turn, lat, 10).coordinates[0]);
        }
        expect(cardboardFor({ polygon: bed }, opts).sheets).toBe(referencePolygonSheets(bed, opts));
      }),
      { numRuns: 150 },
    );
  });

  it("the default sheet is 1.0 × 0.8 m (common practice)", () => {
    expect(DEFAULT_CARDBOARD_SHEET).toEqual({ length_m: 1.0, width_m: 0.8 });
  });
});
