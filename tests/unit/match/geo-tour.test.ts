import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { destination } from "@turf/turf";
import { Geodesic } from "geographiclib-geodesic";
import { boundingBox, inBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";
import { distanceMatrix, loopLength, nearestNeighbourOrder, planTour, twoOpt } from "@/lib/match/tour";

// An independent reference for distances: GeographicLib's ellipsoidal geodesics on WGS84
// (C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87, 2013), npm geographiclib-geodesic.
const geodesicKm = (a: { lat: number; lng: number }, b: { lat: number; lng: number }) => Geodesic.WGS84.Inverse(a.lat, a.lng, b.lat, b.lng).s12! / 1000;

const point = fc.record({ lat: fc.double({ min: -70, max: 70, noNaN: true }), lng: fc.double({ min: -179, max: 179, noNaN: true }) });
const near = (centre: { lat: number; lng: number }, km: number) =>
  fc.record({ bearing: fc.double({ min: -180, max: 180, noNaN: true }), d: fc.double({ min: 0.01, max: km, noNaN: true }) }).map(({ bearing, d }) => {
    const [lng, lat] = destination([centre.lng, centre.lat], d, bearing, { units: "kilometers" }).geometry.coordinates;
    return { lat, lng };
  });

describe("great-circle distances (Turf) against GeographicLib geodesics", () => {
  it("agree within 0.5 % on GeographicLib's published JFK → LHR example (5,551,759.4 m)", () => {
    // GeographicLib documentation: JFK (40.6, -73.8) to LHR (51.6, -0.5), s12 = 5,551,759.400 m.
    const km = distanceKm({ lat: 40.6, lng: -73.8 }, { lat: 51.6, lng: -0.5 });
    expect(Math.abs(km - 5551.7594) / 5551.7594).toBeLessThan(0.005);
    expect(geodesicKm({ lat: 40.6, lng: -73.8 }, { lat: 51.6, lng: -0.5 })).toBeCloseTo(5551.7594, 3);
  });
  it("agree within 0.5 % on GeographicLib's Beijing → San Francisco example (9,513,998 m)", () => {
    // GeographicLib documentation: Beijing (40.1, 116.6) to San Francisco (37.6, -122.4).
    const km = distanceKm({ lat: 40.1, lng: 116.6 }, { lat: 37.6, lng: -122.4 });
    expect(Math.abs(km - 9513.998) / 9513.998).toBeLessThan(0.005);
  });
  // A sphere is flattest-wrong along meridians at the equator, where WGS84's meridian
  // radius of curvature is a(1 − e²) = 6,335 km against the sphere's 6,371 km: 0.56 %. Between
  // 20° and 70° of latitude (where Duffbank's towns lie) the gap stays under 0.5 %, so the
  // random pairs start 30°–70° from the equator and stay within 1,000 km of each other.
  const temperate = fc.record({
    lat: fc.double({ min: 30, max: 70, noNaN: true }).chain((v) => fc.constantFrom(v, -v)),
    lng: fc.double({ min: -179, max: 179, noNaN: true }),
  });
  it("agree within 0.5 % for random pairs at temperate latitudes, near and far", () => {
    fc.assert(
      fc.property(temperate, fc.double({ min: 0.05, max: 1000, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }), (a, km, bearing) => {
        const [lng, lat] = destination([a.lng, a.lat], km, bearing, { units: "kilometers" }).geometry.coordinates;
        const b = { lat, lng };
        const ref = geodesicKm(a, b);
        return Math.abs(distanceKm(a, b) - ref) / ref < 0.005;
      }),
      { numRuns: 500 },
    );
  });
  it("stay within 0.6 % even along the equator's meridians", () => {
    const a = { lat: 0, lng: 0 };
    const b = { lat: 0.5, lng: 0 };
    const ref = geodesicKm(a, b);
    expect(Math.abs(distanceKm(a, b) - ref) / ref).toBeLessThan(0.006);
    expect(Math.abs(distanceKm(a, b) - ref) / ref).toBeGreaterThan(0.005);
  });
});

describe("the bounding box prefilter", () => {
  it("never drops a point inside the radius, right up to its edge", () => {
    fc.assert(
      fc.property(
        point,
        fc.double({ min: 0.1, max: 200, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: 0.999, max: 1, noNaN: true }),
        (origin, km, bearing, edge) => {
          const [rawLng, lat] = destination([origin.lng, origin.lat], km * edge, bearing, { units: "kilometers" }).geometry.coordinates;
          // Turf does not wrap longitudes past ±180°; a stored point always lies within them.
          const p = { lat, lng: ((rawLng + 540) % 360) - 180 };
          // Turf's own measure decides what is inside; the box must hold all of that.
          return distanceKm(origin, p) > km || inBox(p, boundingBox(origin, km));
        },
      ),
      { numRuns: 2000 },
    );
  });
  it("is not much bigger than the circle at mid latitudes", () => {
    const b = boundingBox({ lat: 52.2, lng: 0.85 }, 10);
    // 10 km is 0.0899° of latitude on Turf's sphere, and 0.0899° / cos 52.2° = 0.1468° of longitude.
    expect(b.maxLat - 52.2).toBeCloseTo(0.0899, 3);
    expect(b.maxLng - 0.85).toBeCloseTo(0.1468, 3);
  });
});

describe("visiting order", () => {
  const cluster = fc.array(near({ lat: 52.205, lng: 0.847 }, 20), { minLength: 1, maxLength: 12 });
  it("2-opt is never longer than nearest neighbour, and visits every stop once", () => {
    fc.assert(
      fc.property(cluster, (pts) => {
        const m = distanceMatrix({ lat: 52.205, lng: 0.847 }, pts);
        const nn = nearestNeighbourOrder(m);
        const opt = twoOpt(m, nn);
        expect([...opt].sort((a, b) => a - b)).toEqual(pts.map((_, i) => i + 1));
        return loopLength(m, opt) <= loopLength(m, nn) + 1e-9;
      }),
      { numRuns: 400 },
    );
  });
  it("returns to the origin: a single stop is there and back", () => {
    const origin = { lat: 52.205, lng: 0.847 };
    const stop = { lat: 52.215, lng: 0.847 };
    expect(planTour(origin, [stop]).length_km).toBeCloseTo(2 * distanceKm(origin, stop), 12);
  });
  it("untangles a crossing: four corners of a square are visited round, not across", () => {
    const o = { lat: 0, lng: 0 };
    const corners = [{ lat: 0.01, lng: 0.01 }, { lat: 0.01, lng: 0.02 }, { lat: 0, lng: 0.02 }, { lat: 0.001, lng: 0.011 }];
    const tour = planTour(o, corners);
    const m = distanceMatrix(o, corners);
    expect(tour.length_km).toBeLessThanOrEqual(loopLength(m, nearestNeighbourOrder(m)) + 1e-12);
    // The shortest of all 24 orders, by brute force.
    const perms = (xs: number[]): number[][] => (xs.length <= 1 ? [xs] : xs.flatMap((x) => perms(xs.filter((y) => y !== x)).map((p) => [x, ...p])));
    const best = Math.min(...perms([1, 2, 3, 4]).map((p) => loopLength(m, p)));
    expect(tour.length_km).toBeCloseTo(best, 9);
  });
});
