import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createUser, DEPOT_ADDRESS, giveawayBody, inDays } from "../factories";
import * as days from "@/app/api/council/giveaways/route";
import * as day from "@/app/api/council/giveaways/[id]/route";
import * as cancel from "@/app/api/council/giveaways/[id]/cancel/route";
import * as slots from "@/app/api/council/giveaways/[id]/slots/route";
import * as slot from "@/app/api/council/giveaways/[id]/slots/[slotId]/route";
import * as csv from "@/app/api/council/giveaways/[id]/sheet.csv/route";
import * as attendance from "@/app/api/council/giveaways/[id]/bookings/[bookingId]/route";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p: Record<string, string> = {};
let dayA: Awaited<ReturnType<typeof createGiveaway>>;
let bookingId: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  const owner = await createUser({ roles: ["council"] });
  p.ownerA = owner.id;
  p.staffA = (await createUser({ roles: ["council"], organisation_id: owner.organisation_id })).id;
  p.ownerB = (await createUser({ roles: ["council"] })).id;
  p.gardener = (await createUser({ roles: ["gardener"] })).id;
  p.other = (await createUser({ roles: ["gardener"] })).id;
  dayA = await createGiveaway(p.ownerA);
  const b = await bookAs(p.gardener, dayA.id, { slot_id: dayA.slots[0].id, quantity: 3 });
  bookingId = b.json.booking.id;
});
afterAll(() => ctx.close());

describe("council staff create and list days", () => {
  it("records who created the day in the audit log, with the day as it was made", async () => {
    const row = await ctx.db("audit_log").where({ action: "giveaway.create", subject_id: dayA.id }).first();
    expect(row.actor_id).toBe(p.ownerA);
    expect(JSON.parse(row.after)).toMatchObject({ id: dayA.id, address: DEPOT_ADDRESS, slots: [{ capacity: 2 }, { capacity: 1 }] });
  });
  it("lists a council's own days only, with the exact place for staff", async () => {
    const mine = await call(days.GET as never, await request("/api/council/giveaways", { as: p.staffA }));
    expect(mine.json.items.map((d: { id: string }) => d.id)).toEqual([dayA.id]);
    expect(mine.json.items[0].exact.address).toBe(DEPOT_ADDRESS);
    const theirs = await call(days.GET as never, await request("/api/council/giveaways", { as: p.ownerB }));
    expect(theirs.json.items).toEqual([]);
  });
  const BAD: [string, Record<string, unknown>, string][] = [
    ["straw is not a giveaway material", { material: "straw" }, "material"],
    ["a date that is not one", { date: "2027-02-30" }, "date"],
    ["a day in the past", { date: "2020-01-01" }, "date"],
    ["no address", { address: "" }, "address"],
    ["a unit of bales", { unit: "bales" }, "unit"],
    ["a zero cap", { household_cap: 0 }, "household_cap"],
    ["a slot that ends before it starts", { slots: [{ start: "10:00", end: "09:00", capacity: 5 }] }, "slots.0.end"],
    ["a slot of no households", { slots: [{ start: "09:00", end: "10:00", capacity: 0 }] }, "slots.0.capacity"],
    ["a time that is not one", { slots: [{ start: "9am", end: "10:00", capacity: 3 }] }, "slots.0.start"],
    ["booking closing before it opens", { booking_opens_at: "2027-01-02T10:00:00Z", booking_closes_at: "2027-01-01T10:00:00Z" }, "booking_closes_at"],
    ["an unknown time zone", { time_zone: "Mars/Olympus" }, "time_zone"],
    ["a negative deposit", { deposit_cents: -100 }, "deposit_cents"],
    ["a deposit a card cannot hold (below €0.50, Stripe's minimum charge, from memory)", { deposit_cents: 20 }, "deposit_cents"],
  ];
  for (const [label, over, field] of BAD) {
    it(`422 on ${field}: ${label}`, async () => {
      const res = await call(days.POST as never, await request("/api/council/giveaways", { body: giveawayBody(over), as: p.ownerA }));
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
});

// Every staff route for one day, called as different people.
const ROUTES = [
  { name: "GET sheet", run: async (as: string | null, id: string) => call(day.GET as never, await req(`/x`, as), { id }) },
  { name: "PATCH day", run: async (as: string | null, id: string) => call(day.PATCH as never, await req(`/x`, as, "PATCH", { title: "Taken over" }), { id }) },
  { name: "POST slots", run: async (as: string | null, id: string) => call(slots.POST as never, await req(`/x`, as, "POST", { slots: [{ start: "11:00", end: "11:30", capacity: 3 }] }), { id }) },
  { name: "PATCH slot", run: async (as: string | null, id: string) => call(slot.PATCH as never, await req(`/x`, as, "PATCH", { capacity: 9 }), { id, slotId: dayA.slots[0].id }) },
  { name: "DELETE slot", run: async (as: string | null, id: string) => call(slot.DELETE as never, await req(`/x`, as, "DELETE"), { id, slotId: dayA.slots[1].id }) },
  { name: "GET sheet.csv", run: async (as: string | null, id: string) => call(csv.GET as never, await req(`/x`, as), { id }) },
  { name: "PATCH attendance", run: async (as: string | null, id: string) => call(attendance.PATCH as never, await req(`/x`, as, "PATCH", { status: "checked_in" }), { id, bookingId }) },
  { name: "POST cancel", run: async (as: string | null, id: string) => call(cancel.POST as never, await req(`/x`, as, "POST", { reason: "Flooded depot" }), { id }) },
];
function req(url: string, as: string | null, method = "GET", body?: unknown) {
  return request(url, { method, as, body });
}

describe("staff of another council, other roles and visitors", () => {
  for (const r of ROUTES) {
    it(`${r.name}: council B gets 404, a gardener 403, a visitor 401 — and nothing changes`, async () => {
      const before = await snapshot();
      expect((await r.run(p.ownerB, dayA.id)).status).toBe(404);
      expect((await r.run(p.gardener, dayA.id)).status).toBe(403);
      expect((await r.run(null, dayA.id)).status).toBe(401);
      expect(await snapshot()).toEqual(before);
    });
  }
  it("an unknown day is a 404 for its own staff too", async () => {
    expect((await ROUTES[0].run(p.ownerA, "no-such-day")).status).toBe(404);
  });
});

async function snapshot() {
  return {
    days: await ctx.db("giveaway_days").select("*").orderBy("id"),
    slots: await ctx.db("giveaway_slots").select("*").orderBy("id"),
    bookings: await ctx.db("giveaway_bookings").select("*").orderBy("id"),
  };
}

describe("the day's sheet and check-in", () => {
  it("gives staff (not only the owner) the sheet with each household booked", async () => {
    const res = await call(day.GET as never, await request("/x", { as: p.staffA }), { id: dayA.id });
    expect(res.status).toBe(200);
    expect(res.json.bookings).toHaveLength(1);
    expect(res.json.bookings[0]).toMatchObject({ id: bookingId, quantity: 3, status: "booked" });
    expect(res.json.totals).toMatchObject({ households: 1, checked_in: 0, quantity: 3 });
  });
  it("checks a household in, records who did it, and the CSV shows it", async () => {
    const res = await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "checked_in" }, as: p.staffA }), { id: dayA.id, bookingId });
    expect(res.status).toBe(200);
    expect(res.json.booking).toMatchObject({ status: "checked_in", deposit_status: "none" });
    const audit = await ctx.db("audit_log").where({ action: "giveaway.attendance_checked_in", subject_id: bookingId }).first();
    expect(audit.actor_id).toBe(p.staffA);
    expect(JSON.parse(audit.before).status).toBe("booked");
    expect(JSON.parse(audit.after).status).toBe("checked_in");
    const file = await csv.GET(await request("/x", { as: p.staffA }), { params: Promise.resolve({ id: dayA.id }) });
    expect(file.headers.get("content-type")).toContain("text/csv");
    expect(file.headers.get("content-disposition")).toMatch(/attachment; filename="giveaway-.*-leaves\.csv"/);
    const lines = (await file.text()).trim().split("\r\n");
    expect(lines[0]).toBe("slot_start,slot_end,household,email,quantity,unit,status,checked_in_at,deposit_cents,deposit_status,booking_id");
    expect(lines[1]).toMatch(new RegExp(`^${dayA.slots[0].starts_at.slice(0, 10)} 09:00,09:30,Test person \\d+,.*,3,bags,checked_in,`));
  });
  it("422 for an attendance state that does not exist, 404 for a booking of another day", async () => {
    expect((await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "arrived" }, as: p.staffA }), { id: dayA.id, bookingId })).status).toBe(422);
    const other = await createGiveaway(p.ownerA, { title: "Chip day", material: "wood_chips", unit: "m3", household_cap: 1 });
    expect((await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "booked" }, as: p.staffA }), { id: other.id, bookingId })).status).toBe(404);
  });
});

describe("changing a day and its slots", () => {
  it("changes the title, and refuses to move a day households have booked", async () => {
    const ok = await call(day.PATCH as never, await request("/x", { method: "PATCH", body: { title: "Leaf day, main depot" }, as: p.staffA }), { id: dayA.id });
    expect(ok.status).toBe(200);
    expect(ok.json.giveaway.title).toBe("Leaf day, main depot");
    expect(ok.json.giveaway.notes).toBe(""); // untouched fields keep their values
    const moved = await call(day.PATCH as never, await request("/x", { method: "PATCH", body: { date: inDays(9) }, as: p.staffA }), { id: dayA.id });
    expect(moved.status).toBe(409);
  });
  it("moves an unbooked day with its slots keeping their local times", async () => {
    const d = await createGiveaway(p.ownerA, { title: "Compost morning", material: "compost", unit: "m3", household_cap: 0.5 });
    const res = await call(day.PATCH as never, await request("/x", { method: "PATCH", body: { date: inDays(10) }, as: p.ownerA }), { id: d.id });
    expect(res.status).toBe(200);
    expect(res.json.giveaway.slots[0].starts_at).toBe(`${inDays(10)}T09:00:00.000Z`);
  });
  it("adds, resizes and removes slots within what is booked", async () => {
    const add = await call(slots.POST as never, await request("/x", { body: { slots: [{ start: "10:00", end: "10:30", capacity: 4 }] }, as: p.staffA }), { id: dayA.id });
    expect(add.status).toBe(201);
    expect(add.json.slots[0]).toMatchObject({ capacity: 4, remaining: 4 });
    const shrink = await call(slot.PATCH as never, await request("/x", { method: "PATCH", body: { capacity: 0 }, as: p.staffA }), { id: dayA.id, slotId: dayA.slots[0].id });
    expect(shrink.status).toBe(422);
    const tooSmall = await ctx.db("giveaway_slots").where({ id: dayA.slots[0].id }).first();
    expect(tooSmall.capacity).toBe(2);
    const booked = await call(slot.DELETE as never, await request("/x", { method: "DELETE", as: p.staffA }), { id: dayA.id, slotId: dayA.slots[0].id });
    expect(booked.status).toBe(409);
    const empty = await call(slot.DELETE as never, await request("/x", { method: "DELETE", as: p.staffA }), { id: dayA.id, slotId: add.json.slots[0].id });
    expect(empty.status).toBe(204);
  });
});

describe("calling a day off", () => {
  it("cancels every live booking, e-mails each household (no deposit to release), and closes booking", async () => {
    const d = await createGiveaway(p.ownerA, { title: "Second leaf day" });
    await bookAs(p.gardener, d.id, { slot_id: d.slots[0].id, quantity: 2 });
    await bookAs(p.other, d.id, { slot_id: d.slots[0].id, quantity: 1 });
    const res = await call(cancel.POST as never, await request("/x", { body: { reason: "The depot gate is broken." }, as: p.staffA }), { id: d.id });
    expect(res.status).toBe(200);
    expect(res.json.bookings_cancelled).toBe(2);
    expect(res.json.day.status).toBe("cancelled");
    const mails = await renderedRows(ctx.db("email_outbox").where({ template: "giveaway_day_cancelled" }).select("to_address", "template", "data"));
    expect(mails).toHaveLength(2);
    for (const m of mails) {
      expect(m.text_body).toContain("The depot gate is broken.");
      expect(m.text_body).toContain("There was no deposit on this booking");
    }
    const rows = await ctx.db("giveaway_bookings").where({ day_id: d.id });
    expect(rows.every((b: { status: string; deposit_status: string }) => b.status === "cancelled" && b.deposit_status === "none")).toBe(true);
    expect((await ctx.db("giveaway_slots").where({ day_id: d.id })).every((s: { booked: number }) => s.booked === 0)).toBe(true);
    expect((await bookAs(p.gardener, d.id, { slot_id: d.slots[0].id, quantity: 1 })).status).toBe(409);
    expect((await call(cancel.POST as never, await request("/x", { body: { reason: "Again" }, as: p.staffA }), { id: d.id })).status).toBe(409);
    expect((await call(cancel.POST as never, await request("/x", { body: { reason: "" }, as: p.staffA }), { id: dayA.id })).status).toBe(422);
  });
});
