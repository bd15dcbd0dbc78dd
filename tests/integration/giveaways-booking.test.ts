import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { distance, point } from "@turf/turf";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createUser, DEPOT, DEPOT_ADDRESS } from "../factories";
import * as list from "@/app/api/giveaways/route";
import * as one from "@/app/api/giveaways/[id]/route";
import * as booking from "@/app/api/giveaways/[id]/bookings/[bookingId]/route";
import * as calendar from "@/app/api/giveaways/[id]/bookings/[bookingId]/calendar.ics/route";
import { bookGiveaway } from "@/lib/services/giveaways/book-giveaway";
import { cancelGiveawayBooking } from "@/lib/services/giveaways/cancel-giveaway-booking";
import { authOptions } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { rendered } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let council: string;
let ada: string;
let bo: string;
let cy: string;
let day: Awaited<ReturnType<typeof createGiveaway>>;

beforeAll(async () => {
  process.env.BCRYPT_COST = "4";
  ctx = await freshDb({ materials: true });
  council = (await createUser({ roles: ["council"] })).id;
  ada = (await createUser({ roles: ["gardener"] })).id;
  bo = (await createUser({ roles: ["gardener"] })).id;
  cy = (await createUser({ roles: ["supplier"] })).id; // any signed-in account is a household
  day = await createGiveaway(council);
});
afterAll(() => ctx.close());

describe("GET /api/giveaways (public)", () => {
  it("lists upcoming days near a point with the public point only and each slot's room", async () => {
    const res = await call(list.GET as never, await request(`/api/giveaways?lat=${DEPOT.lat}&lng=${DEPOT.lng}&radius_km=5`));
    expect(res.status).toBe(200);
    const item = res.json.items.find((i: { id: string }) => i.id === day.id);
    expect(item).toMatchObject({ id: day.id, material: "leaves", household_cap: 6, unit: "bags" });
    expect(Object.keys(item)).toEqual(expect.arrayContaining(["id", "material", "date", "location", "household_cap", "unit", "slots"]));
    expect(item.slots).toHaveLength(2);
    expect(item.slots[0]).toMatchObject({ capacity: 2, remaining: 2 });
    expect(Object.keys(item.slots[0])).toEqual(expect.arrayContaining(["id", "starts_at", "ends_at", "capacity", "remaining"]));
    // 09:00 on a winter day in Europe/London is 09:00 UTC.
    expect(item.slots[0].starts_at).toBe(`${item.date}T09:00:00.000Z`);
    const moved = distance(point([DEPOT.lng, DEPOT.lat]), point([item.location.lng, item.location.lat]), { units: "meters" });
    expect(moved).toBeGreaterThan(200);
    expect(moved).toBeLessThan(500);
    expect(JSON.stringify(res.json)).not.toContain(DEPOT_ADDRESS);
  });
  it("leaves out days beyond the radius, and lists every upcoming day without a point", async () => {
    const far = await call(list.GET as never, await request(`/api/giveaways?lat=51.5&lng=-0.12&radius_km=10`));
    expect(far.json.items).toEqual([]);
    const all = await call(list.GET as never, await request(`/api/giveaways`));
    expect(all.json.items.map((i: { id: string }) => i.id)).toContain(day.id);
  });
  const BAD: [string, string][] = [
    ["lat=abc&lng=0.8", "lat"],
    ["lat=52.2", "lng"],
    ["lat=95&lng=0.8", "lat"],
    ["lat=52.2&lng=0.8&radius_km=0", "radius_km"],
    ["lat=52.2&lng=0.8&radius_km=500", "radius_km"],
  ];
  for (const [qs, field] of BAD) {
    it(`422 on ${field} for ?${qs}`, async () => {
      const res = await call(list.GET as never, await request(`/api/giveaways?${qs}`));
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
});

describe("POST /api/giveaways/:id/bookings", () => {
  let adaBooking: string;
  it("books a slot: 201 with the booking, the confirmation and its calendar link in the outbox", async () => {
    const res = await bookAs(ada, day.id, { slot_id: day.slots[0].id, quantity: 4 });
    expect(res.status).toBe(201);
    expect(res.json.booking).toMatchObject({ slot_id: day.slots[0].id, quantity: 4, status: "booked" });
    adaBooking = res.json.booking.id;
    const mail = rendered(await ctx.db("email_outbox").where({ template: "giveaway_booked" }).first());
    expect(mail.text_body).toContain(DEPOT_ADDRESS);
    expect(mail.text_body).toContain("4 bags");
    expect(mail.text_body).toMatch(new RegExp(`/api/giveaways/${day.id}/bookings/${adaBooking}/calendar\\.ics\\?t=`));
    // A day without a deposit: confirmed at once, and the e-mail mentions no deposit.
    expect(res.json.booking.deposit_status).toBe("none");
    expect(res.json.checkout_url).toBeUndefined();
    expect(mail.text_body).not.toContain("deposit");
  });
  it("shows the booked household its booking and the exact place, and nobody else", async () => {
    const mine = await call(one.GET as never, await request(`/api/giveaways/${day.id}`, { as: ada }), { id: day.id });
    expect(mine.json.my_booking).toMatchObject({ id: adaBooking, address: DEPOT_ADDRESS, exact: DEPOT });
    const theirs = await call(one.GET as never, await request(`/api/giveaways/${day.id}`, { as: bo }), { id: day.id });
    expect(theirs.json.my_booking).toBeNull();
    const visitor = await call(one.GET as never, await request(`/api/giveaways/${day.id}`), { id: day.id });
    expect(JSON.stringify(visitor.json)).not.toContain(DEPOT_ADDRESS);
    expect(visitor.json.giveaway.slots[0].remaining).toBe(1);
  });
  it("gives the .ics to the e-mailed link without a session, and to no one else", async () => {
    const mail = rendered(await ctx.db("email_outbox").where({ template: "giveaway_booked" }).first());
    const url = new URL(mail.text_body.match(/https?:\/\/\S+calendar\.ics\?t=\S+/)![0]);
    const params = { id: day.id, bookingId: adaBooking };
    const res = await calendar.GET(await request(url.pathname + url.search), { params: Promise.resolve(params) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("text/calendar");
    const ics = await res.text();
    expect(ics).toContain("BEGIN:VEVENT");
    expect(ics).toContain("LOCATION:Depot gate");
    expect(ics).toMatch(/DTSTART:\d{8}T090000Z/);
    expect((await call(calendar.GET as never, await request(`${url.pathname}?t=forged-token-forged-token-forged`), params)).status).toBe(404);
    expect((await call(calendar.GET as never, await request(url.pathname, { as: bo }), params)).status).toBe(404);
    expect((await call(calendar.GET as never, await request(url.pathname, { as: ada }), params)).status).toBe(200);
  });
  it("409 household_limit for a second booking on the same day, even in another slot", async () => {
    const res = await bookAs(ada, day.id, { slot_id: day.slots[1].id, quantity: 1 });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("household_limit");
  });
  it("422 on quantity over the household cap", async () => {
    const res = await bookAs(bo, day.id, { slot_id: day.slots[1].id, quantity: 7 });
    expect(res.status).toBe(422);
    expect(res.json.error.fields.quantity).toContain("6 bags");
  });
  it("409 slot_full when a slot has no room left", async () => {
    expect((await bookAs(bo, day.id, { slot_id: day.slots[1].id, quantity: 2 })).status).toBe(201);
    const res = await bookAs(cy, day.id, { slot_id: day.slots[1].id, quantity: 2 });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("slot_full");
    const slot = await ctx.db("giveaway_slots").where({ id: day.slots[1].id }).first();
    expect(slot.booked).toBe(1);
  });
  const BAD: [string, unknown, number, string | null][] = [
    ["no slot", { quantity: 1 }, 422, "slot_id"],
    ["quantity as words", { slot_id: "x", quantity: "two" }, 422, "quantity"],
    ["a negative quantity", { slot_id: "x", quantity: -1 }, 422, "quantity"],
    ["a slot of another day", { slot_id: "00000000-0000-4000-8000-000000000000", quantity: 1 }, 422, "slot_id"],
  ];
  for (const [label, body, status, field] of BAD) {
    it(`${status} for ${label}`, async () => {
      const res = await bookAs(cy, day.id, body);
      expect(res.status).toBe(status);
      if (field) expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("400 for a body that is not JSON, 401 without a session, 404 for an unknown day", async () => {
    const bad = await call((await import("@/app/api/giveaways/[id]/bookings/route")).POST as never, await request(`/api/giveaways/${day.id}/bookings`, { rawBody: "{", as: cy }), { id: day.id });
    expect(bad.status).toBe(400);
    expect((await bookAs(null, day.id, { slot_id: day.slots[0].id, quantity: 1 })).status).toBe(401);
    expect((await bookAs(cy, "no-such-day", { slot_id: day.slots[0].id, quantity: 1 })).status).toBe(404);
  });
  it("409 before booking opens and after it closes", async () => {
    const later = await createGiveaway(council, { booking_opens_at: new Date(Date.now() + 86_400_000).toISOString() });
    const early = await bookAs(cy, later.id, { slot_id: later.slots[0].id, quantity: 1 });
    expect(early.status).toBe(409);
    expect(early.json.error.message).toMatch(/Booking opens/);
    const closesAt = Date.parse((await ctx.db("giveaway_days").where({ id: day.id }).first()).booking_closes_at);
    await expect(bookGiveaway(cy, day.id, { slot_id: day.slots[0].id, quantity: 1 }, { clock: () => new Date(closesAt + 1000) })).rejects.toMatchObject({ code: "invalid_state" });
  });

  describe("cancelling a booking", () => {
    it("lets the household cancel its own booking before the cut-off and frees the place", async () => {
      const res = await call(booking.DELETE as never, await request(`/api/giveaways/${day.id}/bookings/${adaBooking}`, { method: "DELETE", as: ada }), { id: day.id, bookingId: adaBooking });
      expect(res.status).toBe(200);
      expect(res.json.booking.status).toBe("cancelled");
      const slot = await ctx.db("giveaway_slots").where({ id: day.slots[0].id }).first();
      expect(slot.booked).toBe(0);
      expect(await ctx.db("email_outbox").where({ template: "giveaway_booking_cancelled" }).count({ n: "*" })).toEqual([{ n: 1 }]);
      // The household may book again once its booking is cancelled.
      expect((await bookAs(ada, day.id, { slot_id: day.slots[0].id, quantity: 2 })).status).toBe(201);
    });
    it("404 for someone else's booking, 409 once cancelled, and 409 after the cut-off", async () => {
      const b = await ctx.db("giveaway_bookings").where({ user_id: bo, day_id: day.id }).first();
      const params = { id: day.id, bookingId: b.id };
      expect((await call(booking.DELETE as never, await request("/x", { method: "DELETE", as: ada }), params)).status).toBe(404);
      expect((await call(booking.DELETE as never, await request("/x", { method: "DELETE", as: ada }), { id: day.id, bookingId: adaBooking })).status).toBe(409);
      // Cut-off 12 h before the 09:30 slot; a clock an hour before the slot is too late.
      const slotStart = Date.parse(day.slots[1].starts_at);
      await expect(cancelGiveawayBooking(bo, day.id, b.id, { clock: () => new Date(slotStart - 3_600_000) })).rejects.toMatchObject({ code: "invalid_state" });
      await expect(cancelGiveawayBooking(bo, day.id, b.id, { clock: () => new Date(slotStart - 13 * 3_600_000) })).resolves.toMatchObject({ status: "cancelled" });
    });
  });
});

describe("a suspended account", () => {
  it("can neither sign in nor book", async () => {
    const hash = await hashPassword("a long enough password");
    const { id, email } = await createUser({ roles: ["gardener"], suspended: true, password_hash: hash });
    const provider = authOptions.providers.find((p) => p.id === "credentials") as unknown as { options: { authorize: (c: Record<string, string>) => Promise<unknown> } };
    await expect(provider.options.authorize({ email, password: "a long enough password" })).rejects.toThrow("suspended");
    const res = await bookAs(id, day.id, { slot_id: day.slots[0].id, quantity: 1 });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("suspended");
    expect(await ctx.db("giveaway_bookings").where({ user_id: id }).count({ n: "*" })).toEqual([{ n: 0 }]);
  });
});
