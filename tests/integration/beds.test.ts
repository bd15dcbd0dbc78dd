import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createBed, createUser } from "../factories";
import * as beds from "@/app/api/beds/route";
import * as bed from "@/app/api/beds/[id]/route";
import * as calendar from "@/app/api/beds/[id]/calendar.ics/route";
import { sendBedReminders } from "@/lib/services/beds/send-bed-reminders";
import { updateUser } from "@/db/users";
import { toRequest, valuesFromBed } from "@/components/planner/form-model";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let ada: string;
let bo: string;
let supplierOnly: string;

beforeAll(async () => {
  ctx = await freshDb();
  ada = (await createUser({ roles: ["gardener"] })).id;
  bo = (await createUser({ roles: ["gardener"] })).id;
  supplierOnly = (await createUser({ roles: ["supplier"] })).id;
});
afterAll(() => ctx.close());

/** A square `side` m across, its south-west corner `at` m east and north of a point in Fernhollow. */
const square = (at: number, side: number) => {
  const dLat = 1 / 111_195;
  const dLng = 1 / (111_195 * Math.cos((52.2 * Math.PI) / 180));
  const p = (x: number, y: number) => [0.85 + x * dLng, 52.2 + y * dLat];
  return [p(at, at), p(at + side, at), p(at + side, at + side), p(at, at + side), p(at, at)];
};

const good = { name: "Front strip", bed: { length_m: 3, width_m: 1.2 }, start_date: "2027-03-01", location: { lat: 52.2, lng: 0.85 } };

describe("beds: save, list, read, change, delete", () => {
  let id: string;
  it("saves a bed and answers with its estimate", async () => {
    const res = await call(beds.POST as never, await request("/api/beds", { body: good, as: ada }));
    expect(res.status).toBe(201);
    id = res.json.bed.id;
    expect(res.json.bed).toMatchObject({ name: "Front strip", area_m2: 3.6, start_date: "2027-03-01", location: { lat: 52.2, lng: 0.85 } });
    expect(res.json.estimate.needs.find((n: { material: string }) => n.material === "leaves").quantity).toBe(0.45);
  });
  it("lists only my beds", async () => {
    const mine = await call(beds.GET as never, await request("/api/beds", { as: ada }));
    expect(mine.json.items.map((b: { id: string }) => b.id)).toEqual([id]);
    const theirs = await call(beds.GET as never, await request("/api/beds", { as: bo }));
    expect(theirs.json.items).toEqual([]);
  });
  it("changes the recipe and the estimate follows", async () => {
    const res = await call(bed.PATCH as never, await request(`/api/beds/${id}`, { method: "PATCH", body: { layers: { leaves: { depth_cm: 20 }, straw: false } }, as: ada }), { id });
    expect(res.status).toBe(200);
    const leaves = res.json.estimate.needs.find((n: { material: string }) => n.material === "leaves");
    expect(leaves.quantity).toBeCloseTo(0.72, 6); // 3.6 m² × 0.20 m
    expect(res.json.estimate.needs.some((n: { material: string }) => n.material === "straw")).toBe(false);
  });
  it("refuses an unknown layer or field on a change, and keeps the saved recipe", async () => {
    for (const [body, field] of [[{ layers: { plutonium: true } }, "layers.plutonium"], [{ colour: "red" }, "colour"]] as const) {
      const res = await call(bed.PATCH as never, await request(`/api/beds/${id}`, { method: "PATCH", body, as: ada }), { id });
      expect(res.status).toBe(422);
      expect(Object.keys(res.json.error.fields)).toContain(field);
    }
    const res = await call(bed.GET as never, await request(`/api/beds/${id}`, { as: ada }), { id });
    expect(res.json.bed.layers).toEqual({ leaves: { depth_cm: 20 }, straw: false });
  });
  it("gives the timeline as an iCalendar file", async () => {
    const res = await calendar.GET(await request(`/api/beds/${id}/calendar.ics`, { as: ada }), { params: Promise.resolve({ id }) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("text/calendar");
    const text = await res.text();
    expect(text).toMatch(/^BEGIN:VCALENDAR/);
    expect(text).toContain("DTSTART;VALUE=DATE:20270301");
    expect(text.match(/BEGIN:VEVENT/g)!.length).toBeGreaterThan(6);
    // Built 1 Mar 2027 at 52.2° N, ready 1 Mar 2028; the leaves after that come on 15 Oct 2028.
    expect(text).toContain("DTSTART;VALUE=DATE:20280301");
    expect(text).toContain("DTSTART;VALUE=DATE:20281015");
  });

  // Table-driven: who may touch the bed, and what bad input gets.
  const ACCESS: [string, () => string | null, number][] = [
    ["anonymous", () => null, 401],
    ["a supplier without the gardener role", () => supplierOnly, 403],
    ["another gardener", () => bo, 404],
  ];
  for (const [who, as, status] of ACCESS) {
    it(`${who} gets ${status} on read, change, delete and calendar`, async () => {
      const u = as();
      expect((await call(bed.GET as never, await request(`/api/beds/${id}`, { as: u }), { id })).status).toBe(status);
      expect((await call(bed.PATCH as never, await request(`/api/beds/${id}`, { method: "PATCH", body: { name: "Mine now" }, as: u }), { id })).status).toBe(status);
      expect((await call(bed.DELETE as never, await request(`/api/beds/${id}`, { method: "DELETE", as: u }), { id })).status).toBe(status);
      expect((await call(calendar.GET as never, await request(`/api/beds/${id}/calendar.ics`, { as: u }), { id })).status).toBe(status);
    });
  }
  const BAD: [string, unknown, string][] = [
    ["a hole outside the outline", { ...good, bed: { polygon: { type: "Polygon", coordinates: [square(0, 10), square(20, 5)] } } }, "bed.polygon"],
    ["a hole bigger than the outline", { ...good, bed: { polygon: { type: "Polygon", coordinates: [square(0, 10), square(-5, 20)] } } }, "bed.polygon"],
    ["an unknown layer", { ...good, layers: { plutonium: true } }, "layers.plutonium"],
    ["an unknown field", { ...good, colour: "red" }, "colour"],
    ["no name", { ...good, name: "" }, "name"],
    ["a bed too big", { ...good, bed: { length_m: 500, width_m: 500 } }, "bed"],
    ["a bad date", { ...good, start_date: "01/03/2027" }, "start_date"],
    ["a start in the year 9999", { ...good, start_date: "9999-06-01" }, "start_date"],
    ["a location off the globe", { ...good, location: { lat: 91, lng: 0 } }, "location.lat"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 on ${field}: ${label}`, async () => {
      const res = await call(beds.POST as never, await request("/api/beds", { body, as: ada }));
      expect(res.status).toBe(422);
      expect(Object.keys(res.json.error.fields).some((k) => k === field || k.startsWith(`${field}.`))).toBe(true);
    });
  }
  it("deletes the bed for its owner", async () => {
    expect((await call(bed.DELETE as never, await request(`/api/beds/${id}`, { method: "DELETE", as: ada }), { id })).status).toBe(204);
    expect((await call(bed.GET as never, await request(`/api/beds/${id}`, { as: ada }), { id })).status).toBe(404);
  });
});

describe("beds: editing in the planner form", () => {
  // Wood chips, a sheet size and a stocking rate are taken by the API; the edit form must hand them back.
  const recipe = {
    cardboard: { overlap_cm: 20, sheet_length_m: 1.1, sheet_width_m: 0.7 },
    leaves: { depth_cm: 15 },
    straw: false,
    wood_chips: { depth_cm: 10 },
    worms: { kg_per_m2: 1 },
  };
  for (const system of ["metric", "imperial"] as const) {
    it(`keeps every layer setting when a bed is saved from the edit form untouched (${system})`, async () => {
      const made = await call(beds.POST as never, await request("/api/beds", { body: { ...good, layers: recipe }, as: ada }));
      expect(made.status).toBe(201);
      const id = made.json.bed.id;
      // What the edit page does: the saved bed as form values, then what the save button sends.
      const read = await call(bed.GET as never, await request(`/api/beds/${id}`, { as: ada }), { id });
      const values = valuesFromBed(read.json.bed, system, "2027-01-01");
      const req = toRequest({ ...values, start_date: "2027-04-01" });
      const body = { name: "Renamed strip", bed: req.bed, layers: req.layers, start_date: req.start_date ?? null, location: values.location };
      const res = await call(bed.PATCH as never, await request(`/api/beds/${id}`, { method: "PATCH", body, as: ada }), { id });
      expect(res.status).toBe(200);
      expect(res.json.bed).toMatchObject({ name: "Renamed strip", start_date: "2027-04-01", shape: good.bed, layers: recipe });
      // 3.6 m² × 0.10 m of chips = 0.36 m³ (volume = area × depth).
      expect(res.json.estimate.needs.find((n: { material: string }) => n.material === "wood_chips").quantity).toBeCloseTo(0.36, 6);
    });
  }
});

describe("timeline reminders", () => {
  it("queue each step once on its day, skip old ones, and respect the opt-out", async () => {
    await call(beds.POST as never, await request("/api/beds", { body: { ...good, name: "Reminder bed", start_date: "2027-03-01" }, as: bo }));
    const outbox = () => renderedRows(ctx.db("email_outbox").where({ template: "bed_reminder" }).select("template", "data", "dedupe_key"));

    // The day before building: nothing is due.
    await sendBedReminders({ clock: () => new Date("2027-02-28T08:00:00Z") });
    expect(await outbox()).toHaveLength(0);

    // Build day: one reminder; running again the same day adds nothing.
    await sendBedReminders({ clock: () => new Date("2027-03-01T08:00:00Z") });
    await sendBedReminders({ clock: () => new Date("2027-03-01T18:00:00Z") });
    expect((await outbox()).map((m) => m.subject)).toEqual(["Reminder bed: Build day"]);

    // Day 3 brings the first squeeze test.
    await sendBedReminders({ clock: () => new Date("2027-03-04T08:00:00Z") });
    expect((await outbox()).length).toBe(2);

    // Weeks later, the stale steps between are not sent in a heap.
    await sendBedReminders({ clock: () => new Date("2027-06-01T08:00:00Z") });
    const subjects = (await outbox()).map((m) => m.subject);
    expect(subjects).toHaveLength(3);
    expect(subjects[2]).toContain("sunk");

    await updateUser(bo, { reminders_opt_out: true });
    await sendBedReminders({ clock: () => new Date("2027-09-01T08:00:00Z") });
    expect(await outbox()).toHaveLength(3);
  });
});

describe("timeline reminders with a bed that cannot be estimated", () => {
  it("logs and skips that bed, and still mails the owner's other beds", async () => {
    const cy = await createUser({ roles: ["gardener"] });
    // A row saved before outlines were checked for holes: the hole is bigger than the
    // outline, so its area is negative and no estimate can be made for it.
    const broken = {
      name: "Broken outline",
      shape: { polygon: { type: "Polygon", coordinates: [square(0, 10), square(-5, 20)] } },
      area_m2: -300,
      lat: 52.2,
      lng: 0.85,
      start_date: "2027-03-01",
    };
    await createBed({ owner_id: cy.id, ...broken });
    const res = await call(beds.POST as never, await request("/api/beds", { body: { ...good, name: "Sound bed", start_date: "2027-03-01" }, as: cy.id }));
    expect(res.status).toBe(201);
    await createBed({ owner_id: cy.id, ...broken, name: "Broken too" });

    const logged: unknown[][] = [];
    const spy = vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => void logged.push(args));
    try {
      await sendBedReminders({ clock: () => new Date("2027-03-01T08:00:00Z") });
    } finally {
      spy.mockRestore();
    }
    const mails = await renderedRows(ctx.db("email_outbox").where({ template: "bed_reminder", to_address: cy.email }).select("template", "data"));
    expect(mails.map((m) => m.subject)).toEqual(["Sound bed: Build day"]);
    expect(logged).toHaveLength(2);
    expect(String(logged[0][0])).toContain("bed-reminders");
  });
});

describe("timeline reminders after the bed is ready", () => {
  it("mails the first top-up after the ready date", async () => {
    const di = await createUser({ roles: ["gardener"] });
    await call(beds.POST as never, await request("/api/beds", { body: { ...good, name: "Old bed", start_date: "2027-10-01" }, as: di.id }));
    // Built 1 Oct 2027 at 52.2° N: ready 1 Oct 2028, then leaves on 15 Oct 2028.
    await sendBedReminders({ clock: () => new Date("2028-10-15T08:00:00Z") });
    const mails = await renderedRows(ctx.db("email_outbox").where({ template: "bed_reminder", to_address: di.email }).select("template", "data"));
    expect(mails.map((m) => m.subject)).toEqual(["Old bed: Top up with fallen leaves"]);
  });
});
