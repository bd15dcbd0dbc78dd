// The open-needs routes as a client calls them: the contract (GET/POST /api/needs,
// GET/PATCH/DELETE /api/needs/:id), who may call what (401 unsigned, 403 without the gardener
// role to open one, 404 for anyone else's need), and bad input with the field named (a need
// of 0, a radius over 50 km, an unknown material, a date in the past).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createBed, createUser } from "../factories";
import { addDays } from "@/lib/time/zoned";

const needs = await import("@/app/api/needs/route");
const one = await import("@/app/api/needs/[id]/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
const who: Record<string, string> = {};
let bedId = "";
let placelessBed = "";
const today = new Date().toISOString().slice(0, 10);
const later = addDays(today, 60);
const PLACE = { lat: 52.21, lng: 0.85 };

const typed = (over: Record<string, unknown> = {}) => ({ material: "leaves", quantity: 0.5, unit: "m3", radius_km: 5, needed_by: later, location: PLACE, ...over });

async function post(body: unknown, as: string | null = who.ines) {
  return call(needs.POST as never, await request("/api/needs", { as, body }));
}

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  who.ines = (await createUser({ roles: ["gardener"] })).id;
  who.bo = (await createUser({ roles: ["gardener"] })).id;
  who.supplier = (await createUser({ roles: ["supplier"] })).id;
  bedId = (await createBed({ owner_id: who.ines, name: "Back fence", shape: { length_m: 3, width_m: 1.2 }, area_m2: 3.6, lat: 52.2, lng: 0.84, start_date: addDays(today, 90) })).id;
  placelessBed = (await createBed({ owner_id: who.ines, name: "Somewhere" })).id;
});
afterAll(() => ctx.close());

describe("POST /api/needs", () => {
  it("opens a typed need and answers with it, in SI, as its owner sees it", async () => {
    const res = await post(typed());
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.need).toMatchObject({
      material: "leaves",
      quantity: 0.5,
      unit: "m3",
      quantity_reserved: 0,
      quantity_left: 0.5,
      radius_km: 5,
      needed_by: later,
      location: PLACE,
      bed: null,
      alerts: "daily",
      status: "open",
      alert_count: 0,
    });
    const row = await ctx.db("needs").first().where({ id: res.json.need.id });
    expect(row).toMatchObject({ owner_id: who.ines, reach_km: 5, status: "open" });
  });

  it("takes lat and lng beside the other fields, and fills the usual unit and radius", async () => {
    const res = await post({ material: "coffee_grounds", quantity: 12, needed_by: later, lat: 52.2, lng: 0.86 });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.need).toMatchObject({ unit: "kg", radius_km: 10, location: { lat: 52.2, lng: 0.86 } });
  });

  it("takes the amount in bags, litres, cubic feet or pounds, and keeps it in SI", async () => {
    // 12 paper leaf bags of 30 US gal (common practice, no source); NIST HB44: 1 gal = 3.785411784 L.
    const bags = await post(typed({ quantity: 12, unit: "bags" }));
    expect(bags.status, JSON.stringify(bags.json)).toBe(201);
    expect(bags.json.need.unit).toBe("m3");
    expect(bags.json.need.quantity).toBeCloseTo(1.36274824, 6);
    const lb = await post(typed({ material: "coffee_grounds", quantity: 20, unit: "lb" }));
    expect(lb.json.need).toMatchObject({ unit: "kg", quantity: expect.closeTo(9.0718474, 6) }); // NIST HB44: 1 lb = 0.45359237 kg
    const litres = await post(typed({ quantity: 250, unit: "l" }));
    expect(litres.json.need.quantity).toBeCloseTo(0.25, 9);
    const wrong = await post(typed({ material: "worms", quantity: 2, unit: "bags" }));
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.fields.unit).toMatch(/measured in kg/);
  });

  it("reads the names other clients use for the fields, and names them back in errors", async () => {
    const ok = await post({ material: "leaves", amount: 0.3, unit: "m3", radius: 4, deadline: later, lat: 52.2, lng: 0.85 });
    expect(ok.status, JSON.stringify(ok.json)).toBe(201);
    expect(ok.json.need).toMatchObject({ quantity: 0.3, radius_km: 4, needed_by: later, location: { lat: 52.2, lng: 0.85 } });
    const far = await post({ material: "leaves", quantity: 1, unit: "m3", radius: 60, deadline: addDays(today, -2), lat: 95, lng: 0.85 });
    expect(far.status).toBe(422);
    expect(far.json.error.fields).toMatchObject({ radius_km: expect.any(String), radius: expect.any(String), needed_by: expect.any(String), deadline: expect.any(String), lat: expect.any(String) });
  });

  it("reads a date with a time as the day it was written on", async () => {
    const res = await post(typed({ needed_by: `${later}T18:30:00.000Z` }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.need.needed_by).toBe(later);
  });

  it("opens a bed's unmet need with the bed's place and build day", async () => {
    const res = await post({ material: "straw", quantity: 0.18, unit: "m3", bed_id: bedId, alerts: "immediate" });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.need).toMatchObject({ bed: { id: bedId, name: "Back fence" }, location: { lat: 52.2, lng: 0.84 }, needed_by: addDays(today, 90), alerts: "immediate" });
    // The same bed and material again is a conflict, not a second need.
    const again = await post({ material: "straw", quantity: 0.2, unit: "m3", bed_id: bedId });
    expect(again.status).toBe(409);
    expect(await ctx.db("needs").where({ bed_id: bedId, material_code: "straw" }).count({ n: "*" })).toEqual([{ n: 1 }]);
  });

  const BAD: [string, unknown, string][] = [
    ["a need of 0", typed({ quantity: 0 }), "quantity"],
    ["a negative need", typed({ quantity: -2 }), "quantity"],
    ["a radius over 50 km", typed({ radius_km: 50.5 }), "radius_km"],
    ["a radius of 0", typed({ radius_km: 0 }), "radius_km"],
    ["an unknown material", typed({ material: "plutonium" }), "material"],
    ["a date in the past", typed({ needed_by: addDays(today, -1) }), "needed_by"],
    ["a date that is not a date", typed({ needed_by: "2027-02-30" }), "needed_by"],
    ["a past date with a time", typed({ needed_by: `${addDays(today, -3)}T12:00:00Z` }), "needed_by"],
    ["a unit the material is not measured in", typed({ material: "worms", unit: "m3" }), "unit"],
    ["a quantity that is text", typed({ quantity: "lots" }), "quantity"],
    ["no place and no bed", typed({ location: undefined }), "location"],
    ["a latitude off the globe", typed({ location: { lat: 91, lng: 0 } }), "location.lat"],
    ["someone else's bed", { material: "leaves", quantity: 1, bed_id: "not-mine" }, "bed_id"],
    ["a bed with no place, and none given", { material: "leaves", quantity: 1, unit: "m3", bed_id: "PLACELESS" }, "location"],
    ["an alert mode that does not exist", typed({ alerts: "hourly" }), "alerts"],
  ];
  for (const [label, body, field] of BAD) {
    it(`refuses ${label} with 422 naming ${field}, and writes nothing`, async () => {
      const before = await ctx.db("needs").count({ n: "*" });
      const b = JSON.parse(JSON.stringify(body).replace("PLACELESS", placelessBed));
      const res = await post(b);
      expect(res.status, JSON.stringify(res.json)).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      expect(Object.keys(res.json.error.fields)).toContain(field);
      expect(typeof res.json.error.fields[field]).toBe("string");
      expect(await ctx.db("needs").count({ n: "*" })).toEqual(before);
    });
  }

  it("refuses the unsigned (401), a non-gardener (403), non-JSON (415) and broken JSON (400)", async () => {
    expect((await post(typed(), null)).status).toBe(401);
    expect((await post(typed(), who.supplier)).json.error.code).toBe("forbidden");
    const text = await call(needs.POST as never, await request("/api/needs", { as: who.ines, rawBody: JSON.stringify(typed()), headers: { "content-type": "text/plain" } }));
    expect(text.status).toBe(415);
    const broken = await call(needs.POST as never, await request("/api/needs", { as: who.ines, rawBody: "{not json" }));
    expect(broken.status).toBe(400);
  });
});

describe("GET /api/needs and /api/needs/:id", () => {
  it("lists only my own needs; someone else's is a 404 on every route, and left as it was", async () => {
    const mine = await post(typed({ material: "cardboard", quantity: 4, unit: "m2" }));
    const id = mine.json.need.id as string;
    const list = await call(needs.GET as never, await request("/api/needs", { as: who.ines }));
    expect(list.status).toBe(200);
    expect(list.json.needs.map((n: { id: string }) => n.id)).toContain(id);
    const theirs = await call(needs.GET as never, await request("/api/needs", { as: who.bo }));
    expect(theirs.json.needs).toEqual([]);

    for (const [handler, method, body] of [
      [one.GET, "GET", undefined],
      [one.PATCH, "PATCH", { quantity: 9 }],
      [one.DELETE, "DELETE", undefined],
    ] as const) {
      const res = await call(handler as never, await request(`/api/needs/${id}`, { method, as: who.bo, body }), { id });
      expect(res.status, method).toBe(404);
      expect(res.json.error.code).toBe("not_found");
      const unsigned = await call(handler as never, await request(`/api/needs/${id}`, { method, body }), { id });
      expect(unsigned.status, method).toBe(401);
    }
    expect(await ctx.db("needs").first("quantity").where({ id })).toEqual({ quantity: 4 });
    expect((await call(needs.GET as never, await request("/api/needs"))).status).toBe(401);
  });

  it("filters to open needs, or to one bed's", async () => {
    const res = await call(needs.GET as never, await request(`/api/needs?status=open&bed_id=${bedId}`, { as: who.ines }));
    expect(res.json.needs.map((n: { material: string }) => n.material)).toEqual(["straw"]);
    const bad = await call(needs.GET as never, await request("/api/needs?status=maybe", { as: who.ines }));
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.status).toMatch(/\S/);
  });
});

describe("PATCH and DELETE /api/needs/:id", () => {
  let id = "";
  beforeAll(async () => {
    id = (await post(typed({ material: "compost", quantity: 0.3 }))).json.need.id;
  });
  const patch = async (body: unknown, as = who.ines) => call(one.PATCH as never, await request(`/api/needs/${id}`, { method: "PATCH", as, body }), { id });

  it("changes the amount, radius (and its reach band), date and alerts", async () => {
    const res = await patch({ quantity: 0.6, radius_km: 20, needed_by: addDays(today, 30), alerts: "immediate" });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(res.json.need).toMatchObject({ quantity: 0.6, radius_km: 20, needed_by: addDays(today, 30), alerts: "immediate" });
    expect(await ctx.db("needs").first("reach_km").where({ id })).toEqual({ reach_km: 25 });
  });

  for (const [label, body, field] of [
    ["a need of 0", { quantity: 0 }, "quantity"],
    ["a radius over 50 km", { radius_km: 51 }, "radius_km"],
    ["a date in the past", { needed_by: addDays(today, -3) }, "needed_by"],
    ["a unit compost is not measured in", { unit: "m2" }, "unit"],
    ["nothing to change", {}, "_"],
    ["an unknown material", { material: "plutonium" }, "material"],
    ["another material", { material: "leaves", quantity: 0.2 }, "material"],
  ] as const) {
    it(`refuses ${label} with 422 naming ${field}`, async () => {
      const res = await patch(body);
      expect(res.status, JSON.stringify(res.json)).toBe(422);
      expect(Object.keys(res.json.error.fields)).toContain(field);
      expect(await ctx.db("needs").first("quantity", "radius_km").where({ id })).toEqual({ quantity: 0.6, radius_km: 20 });
    });
  }

  it("accepts the need's own material beside a change", async () => {
    const res = await patch({ material: "compost", quantity: 0.6 });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(res.json.need).toMatchObject({ material: "compost", quantity: 0.6 });
  });

  it("closes by hand, refuses edits while closed, and opens again", async () => {
    const closed = await patch({ status: "closed" });
    expect(closed.json.need.status).toBe("closed");
    expect(closed.json.need.closed_at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}/);
    const edit = await patch({ quantity: 1 });
    expect(edit.status).toBe(409);
    const reopened = await patch({ status: "open", quantity: 1 });
    expect(reopened.json.need).toMatchObject({ status: "open", quantity: 1, closed_at: null });
  });

  it("deletes with 204, then it is gone", async () => {
    const res = await call(one.DELETE as never, await request(`/api/needs/${id}`, { method: "DELETE", as: who.ines }), { id });
    expect(res.status).toBe(204);
    const again = await call(one.GET as never, await request(`/api/needs/${id}`, { as: who.ines }), { id });
    expect(again.status).toBe(404);
  });
});
