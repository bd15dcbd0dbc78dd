import { describe, expect, it } from "vitest";
import { boundingBox, inBox } from "@/lib/geo/box";
import { distanceKm } from "@/lib/match/geo";

// Turf's sphere: mean Earth radius 6,371,008.8 m (IUGG mean radius R1 of GRS 80, from memory),
// so 1° of arc is 2π × 6371.0088 / 360 = 111.195 km.
const KM_PER_DEGREE = 111.195;

describe("the box around a search circle", () => {
  it("spans every longitude when the circle crosses the antimeridian", () => {
    const origin = { lat: -16.8, lng: 179.95 };
    const b = boundingBox(origin, 20);
    expect(b.minLng).toBe(-180);
    expect(b.maxLng).toBe(180);
    // Latitude still only ± 20 km of arc.
    expect(b.maxLat - origin.lat).toBeCloseTo(20 / KM_PER_DEGREE, 4);
    // A point 0.1° east, across the line, is about 10.6 km away and inside the box.
    const across = { lat: -16.8, lng: -179.95 };
    expect(distanceKm(origin, across)).toBeLessThan(20);
    expect(inBox(across, b)).toBe(true);
  });

  it("keeps a box that stays short of the antimeridian to its own longitudes", () => {
    const b = boundingBox({ lat: -16.8, lng: 179.5 }, 20);
    expect(b.minLng).toBeGreaterThan(179);
    expect(b.maxLng).toBeLessThan(180);
  });

  it("reaches the pole and every longitude near it, never past ±90°", () => {
    const north = boundingBox({ lat: 89.95, lng: 10 }, 10);
    expect(north).toMatchObject({ maxLat: 90, minLng: -180, maxLng: 180 });
    expect(north.minLat).toBeCloseTo(89.95 - 10 / KM_PER_DEGREE, 4);
    const south = boundingBox({ lat: -89.99, lng: -120 }, 5);
    expect(south).toMatchObject({ minLat: -90, minLng: -180, maxLng: 180 });
    // The far side of the pole, 0.02° of arc away across it (about 2.2 km), is inside.
    const beyond = { lat: -89.99, lng: 60 };
    expect(distanceKm({ lat: -89.99, lng: -120 }, beyond)).toBeCloseTo(0.02 * KM_PER_DEGREE, 2);
    expect(inBox(beyond, south)).toBe(true);
  });
});
