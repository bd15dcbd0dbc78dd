// The demand grid: every cell at least 1 km², measured independently of the code under test
// with GeographicLib's ellipsoidal polygon area (Karney), and every point in the cell it is
// filed under.
import { describe, expect, it } from "vitest";
import { Geodesic } from "geographiclib-geodesic";
import { cellById, cellOf, MIN_CELL_AREA_KM2 } from "@/lib/needs/grid";
import { prng } from "@/seeds/ids";

/** WGS84 area of the cell with its parallels followed closely (many points along each), km². */
function geodesicAreaKm2(c: { south: number; north: number; west: number; east: number }): number {
  const p = Geodesic.WGS84.Polygon(false);
  const steps = 64;
  for (let i = 0; i <= steps; i++) p.AddPoint(c.south, c.west + ((c.east - c.west) * i) / steps);
  for (let i = steps; i >= 0; i--) p.AddPoint(c.north, c.west + ((c.east - c.west) * i) / steps);
  return Math.abs(p.Compute(false, true).area ?? NaN) / 1e6;
}

describe("the demand grid", () => {
  // Fernhollow's latitude, the equator, high latitudes where a sphere and the ellipsoid part
  // most (reference/trade-facts.md: −0.74 % at 70°), both hemispheres, and next to a pole.
  const places: [string, number, number][] = [
    ["Fernhollow", 52.205, 0.847],
    ["the equator", 0.004, 10],
    ["southern temperate", -37.81, 144.96],
    ["58° north", 58.1, -6.4],
    ["70° north", 70.3, 25.1],
    ["80° south", -80.2, 100],
    ["next to the north pole", 89.995, 12],
    ["the antimeridian", 12.5, 179.999],
  ];
  it.each(places)("a cell at %s is at least 1 km² on the WGS84 ellipsoid", (_name, lat, lng) => {
    const c = cellOf(lat, lng);
    expect(geodesicAreaKm2(c)).toBeGreaterThanOrEqual(MIN_CELL_AREA_KM2);
    // And not so large that a council's map says nothing: under about 2 km² away from the poles.
    if (Math.abs(lat) < 85) expect(geodesicAreaKm2(c)).toBeLessThan(2);
  });

  it("files every point in a cell that holds it, and finds the cell again by its id", () => {
    const r = prng(17);
    for (let i = 0; i < 2000; i++) {
      const lat = r() * 179.98 - 89.99;
      const lng = r() * 359.98 - 179.99;
      const c = cellOf(lat, lng);
      expect(lat).toBeGreaterThanOrEqual(c.south - 1e-9);
      expect(lat).toBeLessThan(c.north + 1e-9);
      expect(lng).toBeGreaterThanOrEqual(c.west - 1e-9);
      expect(lng).toBeLessThan(c.east + 1e-9);
      expect(cellById(c.id)).toEqual(c);
    }
  });

  it("puts two doors a few metres apart in one cell, and a point 2 km off in another", () => {
    const a = cellOf(52.2051, 0.8472);
    expect(cellOf(52.20512, 0.84725).id).toBe(a.id);
    expect(cellOf(52.2231, 0.8472).id).not.toBe(a.id); // 2 km north
  });

  it("refuses ids that are not cells", () => {
    for (const id of ["", "x", "1:2:3", "99999:0", "14220:999999"]) expect(cellById(id)).toBeNull();
  });
});
