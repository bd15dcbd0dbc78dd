// No response reveals one person's need, place or name to anyone else, as the exact-address
// tests do for listings: the supplier's preview, the council's map, its CSV and suggestion,
// a supplier's own listing and a gardener's alerts carry only what the thresholds allow.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { destination, point } from "@turf/turf";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createBed, createUser, listingBody } from "../factories";
import { cellOf } from "@/lib/needs/grid";
import { addDays } from "@/lib/time/zoned";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const needs = await import("@/app/api/needs/route");
const nearby = await import("@/app/api/needs/nearby-demand/route");
const alerts = await import("@/app/api/needs/alerts/route");
const oneAlert = await import("@/app/api/needs/alerts/[id]/route");
const demand = await import("@/app/api/council/demand/route");
const demandCsv = await import("@/app/api/council/demand.csv/route");
const listings = await import("@/app/api/listings/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
const today = new Date().toISOString().slice(0, 10);
// Three households in one cell, two in another (below the threshold), one alone.
const HOME = cellOf(52.2081, 0.8502).centre;
const at = (km: number, bearing: number, p: { lat: number; lng: number } = HOME) => {
  const [lng, lat] = destination(point([p.lng, p.lat]), km, bearing, { units: "kilometers" }).geometry.coordinates;
  return { lat: Math.round(lat * 1e6) / 1e6, lng: Math.round(lng * 1e6) / 1e6 };
};
const people: { id: string; email: string; name: string; place: { lat: number; lng: number }; quantity: number; need?: string }[] = [];
let supplier = "";
let council = "";
let gardener = "";
const secrets: string[] = [];

async function person(name: string, place: { lat: number; lng: number }, quantity: number, bedName?: string) {
  const u = await createUser({ roles: ["gardener"], display_name: name });
  const bed = bedName ? (await createBed({ owner_id: u.id, name: bedName, ...place })).id : null;
  const res = await call(needs.POST as never, await request("/api/needs", { as: u.id, body: { material: "leaves", quantity, unit: "m3", radius_km: 10, needed_by: addDays(today, 70), ...(bed ? { bed_id: bed } : { location: place }) } }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  people.push({ id: u.id, email: u.email, name, place, quantity, need: res.json.need.id });
  secrets.push(u.id, u.email, name, res.json.need.id, place.lat.toFixed(5), place.lng.toFixed(5), String(quantity), ...(bedName ? [bedName] : []));
}

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  await person("Zebedee Quartermaine", at(0.1, 10), 0.37, "Zebedee's quince bed");
  await person("Araminta Fothergill", at(0.15, 200), 0.41);
  await person("Bartholomew Scrope", at(0.2, 300), 0.53);
  await person("Clementine Oyelaran", at(2.5, 90), 0.67); // a cell of two
  await person("Desmond Ruskova", at(2.55, 91), 0.71);
  await person("Euphemia Tallis", at(6, 180), 0.29); // alone
  supplier = (await createUser({ roles: ["supplier"] })).id;
  council = (await createUser({ roles: ["council"] })).id;
  gardener = (await createUser({ roles: ["gardener"] })).id;
});
afterAll(() => ctx.close());

/** Nothing in `body` that names or places one person, or gives one person's amount. */
function expectNoSecrets(body: string, what: string) {
  for (const s of secrets) expect(body.includes(s), `${what} carries "${s}"`).toBe(false);
}

describe("the supplier's preview: GET /api/needs/nearby-demand", () => {
  const ask = async (qs: string, as: string | null = supplier) => call(nearby.GET as never, await request(`/api/needs/nearby-demand?${qs}`, { as }));

  it("counts needs in the rings, with a sum only where three people make it up", async () => {
    const res = await ask(`lat=${HOME.lat}&lng=${HOME.lng}&material=leaves`);
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    const byRing = Object.fromEntries(res.json.rings.map((r: any) => [r.radius_km, r]));
    expect(byRing[5]).toMatchObject({ needs: 5, people: 5 });
    expect(byRing[10]).toMatchObject({ needs: 6, people: 6 });
    expect(byRing[5].quantity).toBe(2.7); // 0.37 + 0.41 + 0.53 + 0.67 + 0.71 = 2.69
    expectNoSecrets(JSON.stringify(res.json), "the preview");
  });

  it("gives no amount for fewer than three people, so one person's need cannot be read off", async () => {
    const lone = at(6, 180);
    const res = await ask(`lat=${lone.lat}&lng=${lone.lng}&material=leaves`);
    const ring5 = res.json.rings.find((r: any) => r.radius_km === 5);
    expect(ring5.people).toBe(1);
    expect(ring5.quantity).toBeNull();
    expectNoSecrets(JSON.stringify(res.json), "the preview");
  });

  it("answers the same anywhere in a cell, so sweeping the map cannot trace a need's circle", async () => {
    const c = cellOf(HOME.lat, HOME.lng);
    const a = await ask(`lat=${c.south + 0.0002}&lng=${c.west + 0.0002}&material=leaves`);
    const b = await ask(`lat=${c.north - 0.0002}&lng=${c.east - 0.0002}&material=leaves`);
    expect(a.json.rings).toEqual(b.json.rings);
  });

  for (const [qs, field] of [
    ["lng=0.85&material=leaves", "lat"],
    ["lat=52.2&material=leaves", "lng"],
    ["lat=52.2&lng=0.85", "material"],
    ["lat=52.2&lng=0.85&material=plutonium", "material"],
    ["lat=95&lng=0.85&material=leaves", "lat"],
  ] as const) {
    it(`refuses ?${qs} with 422 naming ${field}`, async () => {
      const res = await ask(qs);
      expect(res.status).toBe(422);
      expect(Object.keys(res.json.error.fields)).toContain(field);
    });
  }

  it("needs a session, and stops an account that sweeps (429)", async () => {
    expect((await ask("lat=52.2&lng=0.85&material=leaves", null)).status).toBe(401);
    const sweeper = (await createUser({ roles: ["supplier"] })).id;
    let last = 0;
    for (let i = 0; i < 121; i++) last = (await ask(`lat=${52 + i * 0.01}&lng=0.85&material=leaves`, sweeper)).status;
    expect(last).toBe(429);
  });
});

describe("the council's map: GET /api/council/demand and its CSV", () => {
  const ask = async (qs: string, as: string | null = council) => call(demand.GET as never, await request(`/api/council/demand?${qs}`, { as }));

  it("shows the cell of three and leaves out the cell of two and the one alone, whole", async () => {
    const res = await ask(`material=leaves&lat=${HOME.lat}&lng=${HOME.lng}`);
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(res.json.cells).toHaveLength(1);
    expect(res.json.cells[0]).toMatchObject({ id: cellOf(HOME.lat, HOME.lng).id, people: 3, needs: 3, quantity: 1.3, unit: "m3" });
    expect(res.json.cells[0].area_km2).toBeGreaterThanOrEqual(1);
    // The summary adds up visible cells only: nothing of the hidden three shows through it.
    expect(res.json.materials.find((m: any) => m.material === "leaves")).toEqual({ material: "leaves", cells: 1, people: 3 });
    expect(res.json.min_people).toBe(3);
    expectNoSecrets(JSON.stringify(res.json), "the council's map");
  });

  it("suggests a giveaway day from the visible cell only", async () => {
    const res = await ask(`material=leaves&lat=${HOME.lat}&lng=${HOME.lng}`);
    expect(res.json.suggestion).toMatchObject({ material: "leaves", households: 3, slots: 1 });
    expect(new Date(`${res.json.suggestion.date}T12:00:00Z`).getUTCDay()).toBe(6);
    expectNoSecrets(JSON.stringify(res.json.suggestion), "the suggestion");
  });

  it("shows nothing once the cell falls below three people", async () => {
    const leaving = people[0];
    await ctx.db("needs").where({ id: leaving.need }).update({ status: "closed" });
    const res = await ask(`material=leaves&lat=${HOME.lat}&lng=${HOME.lng}`);
    expect(res.json.cells).toEqual([]);
    expect(res.json.suggestion).toBeNull();
    await ctx.db("needs").where({ id: leaving.need }).update({ status: "open" });
  });

  it("exports the same cells as CSV, and nothing else", async () => {
    const res = await demandCsv.GET(await request(`/api/council/demand.csv?material=leaves&lat=${HOME.lat}&lng=${HOME.lng}`, { as: council }), { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    const text = await res.text();
    const lines = text.trim().split("\r\n");
    expect(lines[0]).toBe("cell_id,material,centre_lat,centre_lng,south,west,north,east,area_km2,people,open_needs,total_quantity,unit");
    expect(lines).toHaveLength(2);
    expect(lines[1]).toMatch(/,leaves,.*,3,3,1\.3,m3$/);
    expectNoSecrets(text, "the CSV");
  });

  it("is for council staff only", async () => {
    expect((await ask("material=leaves", null)).status).toBe(401);
    expect((await ask("material=leaves", supplier)).status).toBe(403);
    expect((await ask("material=leaves", gardener)).status).toBe(403);
    const bad = await ask("material=leaves&radius_km=80");
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.radius_km).toMatch(/\S/);
  });
});

describe("alerts and listings", () => {
  it("tell the supplier a number of gardeners, and each gardener only about their own alert", async () => {
    const posted = await call(listings.POST as never, await request("/api/listings", { as: supplier, body: listingBody({ location: HOME, address: "9 Hidden Yard, Fernhollow" }) }));
    expect(posted.status, JSON.stringify(posted.json)).toBe(201);
    expect(posted.json.listing.matched_gardeners).toBe(6);
    expectNoSecrets(JSON.stringify(posted.json), "the supplier's own listing");

    const zeb = people[0];
    const mine = await call(alerts.GET as never, await request("/api/needs/alerts", { as: zeb.id }));
    expect(mine.json.alerts).toHaveLength(1);
    const body = JSON.stringify(mine.json);
    // The listing's public point and facts only: never its address or exact point.
    expect(body).not.toContain("Hidden Yard");
    expect(body).not.toContain(String(posted.json.listing.pickup.location.lat));
    for (const other of people.slice(1)) expect(body).not.toContain(other.name);

    const theirs = await call(alerts.GET as never, await request("/api/needs/alerts", { as: gardener }));
    expect(theirs.json.alerts).toEqual([]);
    const alertId = mine.json.alerts[0].id;
    const poke = await call(oneAlert.PATCH as never, await request(`/api/needs/alerts/${alertId}`, { method: "PATCH", as: gardener, body: { dismissed: true } }), { id: alertId });
    expect(poke.status).toBe(404);
    expect(await ctx.db("need_alerts").first("dismissed_at").where({ id: alertId })).toEqual({ dismissed_at: null });
  });
});
