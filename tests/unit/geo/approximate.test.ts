// The key and the shape of the public point (lib/geo/approximate.ts).
import { distance, point } from "@turf/turf";
import { afterEach, describe, expect, it, vi } from "vitest";
import { startupProblems } from "@/lib/env";
import { APPROX_MAX_M, APPROX_MIN_M, approximatePoint, DEMO_LOCATION_SECRET, locationKey, placeOwner } from "@/lib/geo/approximate";

const HOME = { lat: 52.2133, lng: 0.8613 };
const metres = (a: { lat: number; lng: number }, b: { lat: number; lng: number }) => distance(point([a.lng, a.lat]), point([b.lng, b.lat]), { units: "meters" });

afterEach(() => vi.unstubAllEnvs());

describe("the key", () => {
  it("treats an empty LOCATION_SECRET (as .env.example ships it) as unset", () => {
    vi.stubEnv("LOCATION_SECRET", "");
    const withEmpty = approximatePoint({ owner: "user:a", ...HOME });
    expect(locationKey()).toBe(DEMO_LOCATION_SECRET);
    vi.stubEnv("LOCATION_SECRET", "   ");
    expect(locationKey()).toBe(DEMO_LOCATION_SECRET);
    delete process.env.LOCATION_SECRET;
    expect(approximatePoint({ owner: "user:a", ...HOME })).toEqual(withEmpty);
  });

  it("uses a set LOCATION_SECRET, which moves the point elsewhere", () => {
    vi.stubEnv("LOCATION_SECRET", "");
    const demo = approximatePoint({ owner: "user:a", ...HOME });
    vi.stubEnv("LOCATION_SECRET", "a-long-random-production-secret");
    expect(locationKey()).toBe("a-long-random-production-secret");
    expect(approximatePoint({ owner: "user:a", ...HOME })).not.toEqual(demo);
  });

  it("uses the demo key quietly in the demo, development and tests; a production start is refused first (lib/env.ts)", () => {
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    expect(locationKey({ NODE_ENV: "production", DUFFBANK_DEMO: "1", DATABASE_URL: "postgres://x@y/z" })).toBe(DEMO_LOCATION_SECRET);
    expect(locationKey({ NODE_ENV: "development" })).toBe(DEMO_LOCATION_SECRET);
    expect(locationKey({ NODE_ENV: "test", LOCATION_SECRET: "" })).toBe(DEMO_LOCATION_SECRET);
    expect(locationKey({ NODE_ENV: "production", LOCATION_SECRET: "s3cret" })).toBe("s3cret");
    expect(errors).not.toHaveBeenCalled();
    errors.mockRestore();
    expect(startupProblems({ NODE_ENV: "production", LOCATION_SECRET: "" }).join("\n")).toMatch(/LOCATION_SECRET is not set/);
  });
});

describe("the point", () => {
  it("is the same for every listing of one owner at one place", () => {
    const a = approximatePoint({ owner: placeOwner({ owner_id: "shop" }), ...HOME });
    const b = approximatePoint({ owner: placeOwner({ owner_id: "shop", organisation_id: null }), ...HOME });
    expect(b).toEqual(a);
  });

  it("moves pins dropped a few metres apart by the same offset, so their average is no closer", () => {
    const owner = placeOwner({ owner_id: "shop" });
    const pins = [HOME, { lat: 52.21345, lng: 0.86118 }, { lat: 52.21322, lng: 0.86141 }, { lat: 52.21338, lng: 0.86126 }];
    const shown = pins.map((p) => approximatePoint({ owner, ...p }));
    const dLat = shown.map((s, i) => s.lat - pins[i].lat);
    const dLng = shown.map((s, i) => s.lng - pins[i].lng);
    for (const d of dLat) expect(d).toBeCloseTo(dLat[0], 5);
    for (const d of dLng) expect(d).toBeCloseTo(dLng[0], 5);
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    const averaged = { lat: mean(shown.map((s) => s.lat)), lng: mean(shown.map((s) => s.lng)) };
    const truth = { lat: mean(pins.map((p) => p.lat)), lng: mean(pins.map((p) => p.lng)) };
    expect(metres(averaged, truth)).toBeGreaterThanOrEqual(APPROX_MIN_M - 1);
  });

  it("differs between owners at one address, so one owner's offset says nothing of another's", () => {
    const mine = approximatePoint({ owner: placeOwner({ owner_id: "me" }), ...HOME });
    const theirs = approximatePoint({ owner: placeOwner({ owner_id: "neighbour" }), ...HOME });
    const council = approximatePoint({ owner: placeOwner({ owner_id: "me", organisation_id: "org-1" }), ...HOME });
    expect(theirs).not.toEqual(mine);
    expect(council).not.toEqual(mine);
  });

  it("stays within the stated band for places all over", () => {
    for (let i = 0; i < 300; i++) {
      const p = { lat: 50 + (i * 0.0137) % 5, lng: -3 + (i * 0.0291) % 6 };
      const m = metres(p, approximatePoint({ owner: `user:${i % 7}`, ...p }));
      expect(m).toBeGreaterThanOrEqual(APPROX_MIN_M - 1);
      expect(m).toBeLessThanOrEqual(APPROX_MAX_M + 1);
    }
  });
});
