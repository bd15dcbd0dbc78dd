// Finding a place by name (GET /api/places, /api/places/nearest): the seeded gazetteer of
// Fernhollow and its villages by prefix, and a Photon-compatible geocoding service (the local
// fake) asked after it when GEOCODER_URL is set — never a typed coordinate.
import { afterAll, beforeAll, afterEach, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { GET as search } from "@/app/api/places/route";
import { GET as nearest } from "@/app/api/places/nearest/route";
import { addPlaces } from "@/db/places";
import { gazetteerEntries } from "@/seeds/gazetteer";
import { startGeocoderFake, type GeocoderFake } from "@/lib/fakes/geocoder/server";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let fake: GeocoderFake;

beforeAll(async () => {
  ctx = await freshDb();
  await addPlaces(gazetteerEntries(), new Date().toISOString());
  fake = await startGeocoderFake({
    port: 0,
    // A place only the service knows, and one the gazetteer has too (left out of the answer once).
    entries: [
      { id: "x1", kind: "village", name: "Marrowby", context: null, lat: 52.31, lng: 0.99 },
      { ...gazetteerEntries().find((p) => p.name === "Mill Leat Lane")!, id: "x2" },
    ],
  });
});
afterAll(async () => {
  await fake.close();
  await ctx.close();
});
afterEach(() => vi.unstubAllEnvs());

const find = async (query: string) => call(search, await request(`/api/places?${query}`));

describe("GET /api/places from the gazetteer", () => {
  it("finds a village by the start of its name, with its point", async () => {
    const res = await find("q=little%20se");
    expect(res.status).toBe(200);
    expect(res.json.places[0]).toMatchObject({ name: "Little Sedge", kind: "village", label: "Little Sedge", source: "gazetteer" });
    expect(res.json.places[0].lat).toBeCloseTo(52.235, 2);
  });

  it("finds a street by any word of its name, case, apostrophes and accents aside", async () => {
    for (const q of ["tanners", "TANNER'S W", "walk", "tánner"]) {
      const res = await find(`q=${encodeURIComponent(q)}`);
      expect(res.json.places.map((p: any) => p.label), q).toContain("Tanner's Walk, Fernhollow");
    }
  });

  it("finds a street with its town after it, and a postcode with or without its space", async () => {
    expect((await find("q=orchard%20rise%20fern")).json.places.map((p: any) => p.name)).toEqual(["Orchard Rise"]);
    expect((await find("q=fh12")).json.places.map((p: any) => p.name)).toContain("FH1 2BT");
    expect((await find("q=FH1%202B")).json.places.map((p: any) => p.name)).toEqual(["FH1 2BT"]);
  });

  it("puts the town before its streets, and keeps to the limit", async () => {
    const res = await find("q=fern&limit=3");
    expect(res.json.places[0]).toMatchObject({ name: "Fernhollow", kind: "town" });
    expect(res.json.places.length).toBeLessThanOrEqual(3);
  });

  it("answers an empty list for a name nobody uses", async () => {
    expect((await find("q=zzqx")).json).toEqual({ places: [] });
  });

  const bad: [string, string, string][] = [
    ["no q", "", "q"],
    ["one letter", "q=f", "q"],
    ["a limit of 0", "q=fern&limit=0", "limit"],
    ["a limit past 20", "q=fern&limit=50", "limit"],
    ["lat without lng", "q=fern&lat=52", "lng"],
    ["a latitude off the globe", "q=fern&lat=95&lng=0", "lat"],
  ];
  it.each(bad)("refuses %s with 422 and a message on %s", async (_name, query, field) => {
    const res = await find(query);
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("invalid_input");
    expect(res.json.error.fields[field]).toEqual(expect.any(String));
  });
});

describe("with a geocoding service (GEOCODER_URL)", () => {
  it("adds what only the service knows, after the gazetteer, without repeating a place", async () => {
    vi.stubEnv("GEOCODER_URL", fake.url);
    const res = await find("q=marrow");
    expect(res.json.places).toEqual([expect.objectContaining({ name: "Marrowby", kind: "village", source: "geocoder", lat: 52.31, lng: 0.99 })]);
    const mill = await find("q=mill%20leat");
    expect(mill.json.places.filter((p: any) => p.name === "Mill Leat Lane")).toHaveLength(1);
    expect(fake.requests.some((r) => r.startsWith("/api?q=marrow"))).toBe(true);
  });

  it("still answers from the gazetteer when the service is down", async () => {
    vi.stubEnv("GEOCODER_URL", "http://127.0.0.1:9");
    const res = await find("q=hartw");
    expect(res.status).toBe(200);
    expect(res.json.places[0].name).toBe("Hartwell");
  });
});

describe("GET /api/places/nearest", () => {
  it("names a point by the nearest place", async () => {
    const mill = gazetteerEntries().find((p) => p.name === "Mill Leat Lane")!;
    const res = await call(nearest, await request(`/api/places/nearest?lat=${mill.lat + 0.0003}&lng=${mill.lng}`));
    expect(res.status).toBe(200);
    expect(res.json.place).toMatchObject({ label: "Mill Leat Lane, Fernhollow" });
  });

  it("answers null far from anything known, and 422 without a point", async () => {
    expect((await call(nearest, await request("/api/places/nearest?lat=-40&lng=100"))).json).toEqual({ place: null });
    expect((await call(nearest, await request("/api/places/nearest?lat=abc"))).status).toBe(422);
  });
});
