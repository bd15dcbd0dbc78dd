import { describe, expect, it } from "vitest";
import { Geodesic } from "geographiclib-geodesic";
import type { Polygon, Position } from "geojson";
import { isValidRing, polygonArea, polygonCentroid, polygonProblem, rectangleArea } from "@/lib/calc/area";

/** Independent reference: GeographicLib's ellipsoidal (WGS84) polygon area, Karney's algorithm. */
function geodesicArea(ring: Position[]): number {
  const p = Geodesic.WGS84.Polygon(false);
  for (const [lng, lat] of ring.slice(0, -1)) p.AddPoint(lat, lng);
  return Math.abs(p.Compute(false, true).area ?? NaN);
}

const poly = (...rings: Position[][]): Polygon => ({ type: "Polygon", coordinates: rings });

describe("rectangleArea", () => {
  it("is length × width", () => {
    expect(rectangleArea(4, 1.2)).toBeCloseTo(4.8, 12);
  });
  it.each([
    [0, 1],
    [-1, 2],
    [Number.NaN, 1],
    [1, Number.POSITIVE_INFINITY],
  ])("rejects %s × %s", (l, w) => {
    expect(() => rectangleArea(l, w)).toThrow(RangeError);
  });
});

describe("polygonArea against GeographicLib", () => {
  // Turf's sphere (R = 6,371,008.8 m) against the WGS84 ellipsoid. The spherical error of an
  // area depends on latitude (reference/trade-facts.md, Distances, measured against
  // GeographicLib): +0.45 % at the equator, −0.43 % at 53.8°, −0.56 % at 60°, −0.74 % at 70°.
  // So 0.5 % holds only below about 57°; each case states the tolerance for its latitude.
  const cases: [string, Position[], number][] = [
    ["a plot on the equator near Quito", [[-78.5, -0.2], [-78.4997, -0.2], [-78.4997, -0.1998], [-78.5, -0.1998], [-78.5, -0.2]], 0.005],
    ["a garden plot near Lyon", [[4.85, 45.76], [4.85013, 45.76], [4.85013, 45.76009], [4.85, 45.76009], [4.85, 45.76]], 0.005],
    ["an L-shaped bed in Leeds", [[-1.55, 53.8], [-1.5499, 53.8], [-1.5499, 53.80003], [-1.54996, 53.80003], [-1.54996, 53.80008], [-1.55, 53.80008], [-1.55, 53.8]], 0.005],
    ["an allotment in Melbourne", [[144.96, -37.81], [144.9603, -37.8101], [144.9604, -37.8098], [144.96005, -37.8097], [144.96, -37.81]], 0.005],
    ["a near-hectare field in Ohio", [[-83, 40], [-82.9988, 40], [-82.9988, 40.0009], [-83, 40.0009], [-83, 40]], 0.005],
    // Above 57° the sphere reads the area low by more than 0.5 %.
    ["a bed near Gothenburg, 57.7°", [[11.97, 57.7], [11.9704, 57.7], [11.9704, 57.7002], [11.97, 57.7002], [11.97, 57.7]], 0.0055],
    ["a bed near Bergen, 60.4°", [[5.32, 60.39], [5.3204, 60.39], [5.3204, 60.3902], [5.32, 60.3902], [5.32, 60.39]], 0.006],
    ["a bed near Reykjavík, 64.1°", [[-21.9, 64.14], [-21.8996, 64.14], [-21.8996, 64.1402], [-21.9, 64.1402], [-21.9, 64.14]], 0.007],
    ["a bed near Tromsø, 69.65°", [[18.95, 69.65], [18.9504, 69.65], [18.9504, 69.6502], [18.95, 69.6502], [18.95, 69.65]], 0.008],
  ];
  it.each(cases)("%s is within its latitude's tolerance", (_name, ring, tolerance) => {
    const reference = geodesicArea(ring);
    expect(reference).toBeGreaterThan(0);
    expect(Math.abs(polygonArea(poly(ring)) - reference) / reference).toBeLessThan(tolerance);
  });

  it("reads low by more than 0.5 % far north, as the measured spherical error says (so the tolerance must grow)", () => {
    const [, ring] = cases.find(([name]) => name.includes("Tromsø"))!;
    const error = (polygonArea(poly(ring)) - geodesicArea(ring)) / geodesicArea(ring);
    // Measured against GeographicLib: −0.74 % at 70° (trade-facts.md).
    expect(error).toBeLessThan(-0.005);
    expect(error).toBeGreaterThan(-0.008);
  });

  it("subtracts holes", () => {
    const outer: Position[] = [[0, 50], [0.001, 50], [0.001, 50.001], [0, 50.001], [0, 50]];
    const hole: Position[] = [[0.0004, 50.0004], [0.0004, 50.0006], [0.0006, 50.0006], [0.0006, 50.0004], [0.0004, 50.0004]];
    const expected = geodesicArea(outer) - geodesicArea(hole);
    // At 50° the spherical error is under 0.5 %.
    expect(Math.abs(polygonArea(poly(outer, hole)) - expected) / expected).toBeLessThan(0.005);
  });
});

describe("polygonCentroid", () => {
  it("is the middle of a square", () => {
    const c = polygonCentroid(poly([[10, 20], [10.002, 20], [10.002, 20.002], [10, 20.002], [10, 20]]));
    expect(c.lng).toBeCloseTo(10.001, 9);
    expect(c.lat).toBeCloseTo(20.001, 9);
  });

  it("weights by area, not by vertex count", () => {
    // Extra vertices along the west edge must not pull the centre west.
    const c = polygonCentroid(poly([[0, 0], [0.002, 0], [0.002, 0.002], [0, 0.002], [0, 0.0015], [0, 0.001], [0, 0.0005], [0, 0]]));
    expect(c.lng).toBeCloseTo(0.001, 9);
  });
});

describe("isValidRing", () => {
  const square: Position[] = [[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.001], [0, 0]];
  it("accepts a closed, simple ring", () => {
    expect(isValidRing(square)).toBe(true);
    expect(isValidRing(square.map(([x, y]) => [x, y, 12]))).toBe(true); // altitude allowed
  });
  it.each<[string, Position[]]>([
    ["an open ring", square.slice(0, -1).concat([[0.0001, 0]])],
    ["fewer than four positions", [[0, 0], [1, 0], [0, 0]]],
    ["a bow tie", [[0, 0], [0.001, 0.001], [0.001, 0], [0, 0.001], [0, 0]]],
    ["longitude out of range", [[0, 0], [181, 0], [181, 1], [0, 1], [0, 0]]],
    ["latitude out of range", [[0, 89], [1, 89], [1, 91], [0, 91], [0, 89]]],
    ["a non-finite coordinate", [[0, 0], [Number.NaN, 0], [1, 1], [0, 1], [0, 0]]],
    ["all points on one line", [[0, 0], [0.001, 0], [0.002, 0], [0, 0]]],
  ])("rejects %s", (_name, ring) => {
    expect(isValidRing(ring)).toBe(false);
  });
});

describe("polygonProblem", () => {
  // Squares in degrees; plane reasoning is enough to say which rings meet.
  const sq = (x: number, y: number, s: number): Position[] => [[x, y], [x + s, y], [x + s, y + s], [x, y + s], [x, y]];
  const outer = sq(0, 50, 0.001);

  it("accepts an outline alone and one with holes apart inside it", () => {
    expect(polygonProblem(poly(outer))).toBeNull();
    expect(polygonProblem(poly(outer, sq(0.0001, 50.0001, 0.0002), sq(0.0005, 50.0005, 0.0002)))).toBeNull();
  });

  it.each<[string, Position[][], number | null]>([
    ["a ring that crosses itself", [[[0, 50], [0.001, 50.001], [0.001, 50], [0, 50.001], [0, 50]]], 0],
    ["a hole outside", [outer, sq(0.002, 50, 0.0005)], 1],
    ["a hole around the outline", [outer, sq(-0.0005, 49.9995, 0.002)], 1],
    ["a hole equal to the outline", [outer, outer], 1],
    ["a hole across the edge", [outer, sq(0.0008, 50.0002, 0.0004)], 1],
    ["a hole touching the edge at a corner", [outer, [[0.001, 50.0005], [0.0008, 50.0006], [0.0008, 50.0004], [0.001, 50.0005]]], 1],
    ["two holes overlapping", [outer, sq(0.0001, 50.0001, 0.0004), sq(0.0003, 50.0003, 0.0004)], 2],
    ["a hole inside a hole", [outer, sq(0.0001, 50.0001, 0.0006), sq(0.0002, 50.0002, 0.0002)], 2],
  ])("finds %s (ring %s)", (_name, rings, ring) => {
    expect(polygonProblem(poly(...rings))?.ring).toBe(ring);
  });

  it("never passes a polygon whose area is not positive", () => {
    for (const rings of [[outer, outer], [outer, sq(-0.0005, 49.9995, 0.002)]]) {
      expect(polygonArea(poly(...rings))).toBeLessThanOrEqual(0);
      expect(polygonProblem(poly(...rings))).toMatchObject({ message: expect.stringMatching(/\w/) });
    }
  });
});
