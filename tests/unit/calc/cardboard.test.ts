import { describe, expect, it } from "vitest";
import fc from "fast-check";
import type { Polygon } from "geojson";
import { polygonArea } from "@/lib/calc/area";
import { cardboardFor, cardboardLayout } from "@/lib/calc/cardboard";
import { CARDBOARD_OVERLAP_CM, DEFAULT_CARDBOARD_SHEET, EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";
import { polygonFromMetres, uncoveredPoints } from "../../helpers/cardboard-oracle";

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

  it("refuses an overlap of more than half the sheet, which would bury most of each sheet (a product limit)", () => {
    // 35 cm sheets with 30 cm seams add 5 cm of new ground each: refused, on any bed.
    expect(() => cardboardFor({ length_m: 2, width_m: 2 }, { sheet_length_m: 0.35, sheet_width_m: 0.35, overlap_cm: 30 })).toThrow(RangeError);
    // 60 cm sheets with 30 cm seams sit exactly at the limit: ceil(1.7 / 0.3) = 6 each way.
    expect(cardboardFor({ length_m: 2, width_m: 2 }, { sheet_length_m: 0.6, sheet_width_m: 0.6, overlap_cm: 30 }).sheets).toBe(36);
  });
});

// The L of the second audit: a 4 × 3 m outline with 1.5 m wide arms, along x and up y.
const L_SHAPE: [number, number][] = [[0, 0], [4, 0], [4, 1.5], [1.5, 1.5], [1.5, 3], [0, 3]];

/** The same ring drawn backwards, or from another corner. */
const reversed = (p: Polygon): Polygon => ({ type: "Polygon", coordinates: p.coordinates.map((r) => [...r].reverse()) });
const startingAt = (p: Polygon, k: number): Polygon => ({
  type: "Polygon",
  coordinates: p.coordinates.map((r) => {
    const open = r.slice(0, -1);
    const turned = [...open.slice(k % open.length), ...open.slice(0, k % open.length)];
    return [...turned, turned[0]];
  }),
});
/** Its mirror image across the meridian through its first corner. */
const mirrored = (p: Polygon): Polygon => {
  const lng0 = p.coordinates[0][0][0];
  return { type: "Polygon", coordinates: p.coordinates.map((r) => r.map(([x, y]) => [2 * lng0 - x, y])) };
};

describe("cardboardFor a polygon", () => {
  it.each([0, 0.5, 1.2, 2.9])("counts a 4 × 2 m rectangle turned %s rad the same as the rectangle (15 sheets)", (turn) => {
    const bed = polygonFromMetres([[0, 0], [4, 0], [4, 2], [0, 2]], turn);
    expect(cardboardFor({ polygon: bed }).sheets).toBe(15);
  });

  it("lays the L in 18 sheets however it is drawn (by hand)", () => {
    // The grid lines up with the 4 m edge. 1.0 × 0.8 m sheets, 0.15 m seams; cell i along an
    // axis ends at the far edge of sheet i, sheet + i × pitch.
    //   sheets' 0.8 m side along x (pitch 0.65 × 0.85), from the corner of both arms:
    //     the 4 m arm (y ≤ 1.5) meets rows 0–1 (row 1 ends at 1.85) of ceil(3.85/0.65) = 6
    //     columns: 12; the 3 m arm (x ≤ 1.5) meets columns 0–2 (column 2 ends at 2.1) of
    //     ceil(2.85/0.85) = 4 rows: 12; 2 × 3 counted twice: 18.
    //   1.0 m side along x: 3 rows × 5 columns + 2 columns × 5 rows − 6 = 19. From the other
    //   corners, 18 at best. Fewer wins.
    const variants: Polygon[] = [];
    for (const [sx, sy] of [[1, 1], [-1, 1], [1, -1], [-1, -1]]) {
      const bed = polygonFromMetres(L_SHAPE.map(([x, y]) => [sx * x, sy * y]));
      variants.push(bed, reversed(bed));
      for (let k = 1; k < 6; k++) variants.push(startingAt(bed, k));
    }
    for (const bed of variants) expect(cardboardFor({ polygon: bed }).sheets).toBe(18);
  });

  it("never gives an outline fewer sheets than the 54-sheet rectangle inside it", () => {
    // 7.5 × 4 m: ceil(7.35/0.85) = 9 along by ceil(3.85/0.65) = 6 across = 54 (turned: 12 × 5 = 60).
    expect(cardboardFor({ length_m: 7.5, width_m: 4 }).sheets).toBe(54);
    // The same rectangle with a 1 m deep bite taken out of a corner of a bigger outline round it.
    const bed = polygonFromMetres([[0, 0], [7.5, 0], [8.2, 1.1], [7.5, 4], [3, 4.6], [0, 4]]);
    const layout = cardboardLayout(bed);
    expect(layout.sheets).toBeGreaterThanOrEqual(54);
    expect(uncoveredPoints(bed, layout.sheet_rings, 0.05)).toEqual([]);
  });

  it("skips sheets over a hole", () => {
    const outer = polygonFromMetres([[0, 0], [10, 0], [10, 10], [0, 10]]);
    const hole = polygonFromMetres([[3, 3], [3, 7], [7, 7], [7, 3]]).coordinates[0];
    const withHole: Polygon = { type: "Polygon", coordinates: [outer.coordinates[0], hole] };
    const layout = cardboardLayout(withHole);
    expect(layout.sheets).toBeLessThan(cardboardFor({ polygon: outer }).sheets);
    expect(uncoveredPoints(withHole, layout.sheet_rings, 0.05)).toEqual([]);
  });

  it("gives the layout's own count", () => {
    const bed = polygonFromMetres(L_SHAPE, 0.3);
    const layout = cardboardLayout(bed);
    expect(layout.sheet_rings).toHaveLength(layout.sheets);
    expect(layout.sheets).toBe(cardboardFor({ polygon: bed }).sheets);
    expect(uncoveredPoints(bed, layout.sheet_rings, 0.02)).toEqual([]);
  });
});

describe("cardboardFor a long thin outline", () => {
  it("counts an L with 4 m wide arms 1,200 m and 1,000 m long by its arms, not its bounding box", () => {
    // Drawn on the equator, where a degree is the same length both ways, so the local
    // projection keeps the L's right angles; the 1,200 m edge is the longest, so the grid
    // lines up with it. By hand, 1.0 × 0.8 m sheets, 0.15 m seams; cell i along an axis
    // ends at the far edge of sheet i, sheet + i × pitch:
    //   from the L's outer corner, long side along x (pitch 0.85 × 0.65): columns
    //     ceil(1199.85/0.85) = 1412, rows ceil(999.85/0.65) = 1539; the arm along x (y ≤ 4)
    //     meets rows 0–5 (row 5 ends at 0.8 + 5 × 0.65 = 4.05), the arm along y (x ≤ 4)
    //     meets columns 0–4 (column 4 ends at 1.0 + 4 × 0.85 = 4.4):
    //     6 × 1412 + 5 × 1539 − 6 × 5 = 16,137.
    //   turned (pitch 0.65 × 0.85): 5 × ceil(1199.85/0.65) + 6 × ceil(999.85/0.85) − 30
    //     = 5 × 1846 + 6 × 1177 − 30 = 16,262. From the far ends the arms meet one more row
    //     or column. Fewer wins.
    const k = (Math.PI / 180) * EARTH_MEAN_RADIUS_M;
    const xy = [[0, 0], [1200, 0], [1200, 4], [4, 4], [4, 1000], [0, 1000], [0, 0]];
    const bed: Polygon = { type: "Polygon", coordinates: [xy.map(([x, y]) => [10 + x / k, y / k])] };
    expect(cardboardFor({ polygon: bed }).sheets).toBe(16_137);
  });
});

describe("cardboard properties (fast-check)", () => {
  // Seams at most half the sheet's shorter side, as the schema allows.
  const sheet = fc
    .record({
      sheet_length_m: fc.double({ min: 0.35, max: 3, noNaN: true }),
      sheet_width_m: fc.double({ min: 0.35, max: 3, noNaN: true }),
      share: fc.double({ min: 0, max: 1, noNaN: true }),
    })
    .map(({ sheet_length_m, sheet_width_m, share }) => {
      const most = Math.min(30, (100 * Math.min(sheet_length_m, sheet_width_m)) / 2);
      return { sheet_length_m, sheet_width_m, overlap_cm: Math.min(most, 10 + share * 20) };
    });
  const starXY = (radii: number[]) =>
    radii.map((r, i): [number, number] => {
      const a = (2 * Math.PI * i) / radii.length;
      return [r * Math.cos(a), r * Math.sin(a)];
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

  it("the sheets laid cover every point of the outline, holes left bare (grid oracle)", () => {
    const star = fc.array(fc.double({ min: 1, max: 8, noNaN: true }), { minLength: 3, maxLength: 12 });
    const hole = fc.option(fc.record({ r: fc.double({ min: 0.2, max: 0.9, noNaN: true }), n: fc.integer({ min: 3, max: 7 }) }));
    fc.assert(
      fc.property(star, hole, fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: -65, max: 65, noNaN: true }), sheet, (radii, h, turn, lat, opts) => {
        const bed = polygonFromMetres(starXY(radii), turn, lat, 10);
        if (h) {
          // A small regular polygon about the centre, inside the star's smallest radius.
          const r = h.r * Math.min(...radii) * Math.cos(Math.PI / radii.length);
          const ring = Array.from({ length: h.n }, (_, i): [number, number] => [r * Math.cos((2 * Math.PI * i) / h.n), r * Math.sin((2 * Math.PI * i) / h.n)]);
          bed.coordinates.push(polygonFromMetres(ring, turn, lat, 10).coordinates[0]);
        }
        const layout = cardboardLayout(bed, opts);
        expect(layout.sheet_rings).toHaveLength(layout.sheets);
        expect(layout.sheets).toBe(cardboardFor({ polygon: bed }, opts).sheets);
        expect(layout.area_m2).toBeGreaterThanOrEqual(polygonArea(bed));
        expect(uncoveredPoints(bed, layout.sheet_rings, 0.05, 6000)).toEqual([]);
      }),
      { numRuns: 80 },
    );
  });

  it("the count does not change with the drawing direction, the starting corner or a mirror image", () => {
    const star = fc.array(fc.double({ min: 1, max: 12, noNaN: true }), { minLength: 3, maxLength: 12 });
    fc.assert(
      fc.property(star, fc.nat(), fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: -65, max: 65, noNaN: true }), sheet, (radii, k, turn, lat, opts) => {
        const bed = polygonFromMetres(starXY(radii), turn, lat, 10);
        const n = cardboardFor({ polygon: bed }, opts).sheets;
        expect(cardboardFor({ polygon: reversed(bed) }, opts).sheets).toBe(n);
        expect(cardboardFor({ polygon: startingAt(bed, k) }, opts).sheets).toBe(n);
        expect(cardboardFor({ polygon: mirrored(bed) }, opts).sheets).toBe(n);
        expect(cardboardFor({ polygon: reversed(mirrored(bed)) }, opts).sheets).toBe(n);
      }),
      { numRuns: 100 },
    );
  });

  it("an outline is never given fewer sheets than a rectangle it contains", () => {
    // A rectangle L × W, turned any way, inside an outline that passes through or beyond each
    // of its corners and bulges out between them (a star about its centre that contains it).
    const bulges = fc.array(fc.record({ at: fc.double({ min: 0.05, max: 0.95, noNaN: true }), out: fc.double({ min: 0, max: 0.6, noNaN: true }) }), { maxLength: 8 });
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 12, noNaN: true }),
        fc.double({ min: 0.5, max: 12, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 0.3, noNaN: true }), { minLength: 4, maxLength: 4 }),
        bulges,
        fc.double({ min: 0, max: Math.PI, noNaN: true }),
        sheet,
        (l, w, cornerOut, extra, turn, opts) => {
          const corners: [number, number][] = [[l / 2, w / 2], [-l / 2, w / 2], [-l / 2, -w / 2], [l / 2, -w / 2]];
          const xy: [number, number][] = [];
          corners.forEach(([cx, cy], i) => {
            const grow = 1 + cornerOut[i];
            xy.push([cx * grow, cy * grow]);
            // Bulges on the side from this corner to the next, pushed out from the centre.
            const [nx, ny] = corners[(i + 1) % 4];
            for (const b of extra.filter((_, j) => j % 4 === i).sort((a, c) => a.at - c.at)) {
              const px = cx + (nx - cx) * b.at;
              const py = cy + (ny - cy) * b.at;
              xy.push([px * (1 + b.out), py * (1 + b.out)]);
            }
          });
          const bed = polygonFromMetres(xy, turn, 52, 1);
          const inside = cardboardFor({ length_m: l, width_m: w }, opts).sheets;
          expect(cardboardFor({ polygon: bed }, opts).sheets).toBeGreaterThanOrEqual(inside);
        },
      ),
      { numRuns: 150 },
    );
  });

  it("the default sheet is 1.0 × 0.8 m (common practice)", () => {
    expect(DEFAULT_CARDBOARD_SHEET).toEqual({ length_m: 1.0, width_m: 0.8 });
  });
});
