// Whole bags, m³ to the hundredth: bookings and household caps that break this are a 422 on
// the field, whichever way they come in (a new day, a changed day, a booking).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createUser, giveawayBody } from "../factories";
import * as councilDays from "@/app/api/council/giveaways/route";
import * as councilDay from "@/app/api/council/giveaways/[id]/route";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let council: string;
let bagsDay: Awaited<ReturnType<typeof createGiveaway>>;
let m3Day: Awaited<ReturnType<typeof createGiveaway>>;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  council = (await createUser({ roles: ["council"] })).id;
  bagsDay = await createGiveaway(council, { unit: "bags", household_cap: 6, slots: [{ start: "09:00", end: "10:00", capacity: 20 }] });
  m3Day = await createGiveaway(council, { material: "wood_chips", unit: "m3", household_cap: 1.5, slots: [{ start: "09:00", end: "10:00", capacity: 20 }] });
});
afterAll(() => ctx.close());

const household = async () => (await createUser({ roles: ["gardener"] })).id;

describe("booking quantities", () => {
  for (const quantity of [2.5, 0.5, 5.01]) {
    it(`refuses ${quantity} bags with 422 on quantity, and books nothing`, async () => {
      const res = await bookAs(await household(), bagsDay.id, { slot_id: bagsDay.slots[0].id, quantity });
      expect(res.status, JSON.stringify(res.json)).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields.quantity).toMatch(/whole number of bags/);
    });
  }
  it("books a whole number of bags", async () => {
    const res = await bookAs(await household(), bagsDay.id, { slot_id: bagsDay.slots[0].id, quantity: 3 });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.booking.quantity).toBe(3);
  });
  it("books m³ to two decimal places", async () => {
    const res = await bookAs(await household(), m3Day.id, { slot_id: m3Day.slots[0].id, quantity: 0.25 });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.booking.quantity).toBe(0.25);
  });
  it("refuses m³ past two decimal places with 422 on quantity", async () => {
    const res = await bookAs(await household(), m3Day.id, { slot_id: m3Day.slots[0].id, quantity: 0.255 });
    expect(res.status, JSON.stringify(res.json)).toBe(422);
    expect(res.json.error.fields.quantity).toMatch(/\S/);
  });
  it("has no booking rows for the refused attempts", async () => {
    const rows = await ctx.db("giveaway_bookings").select("quantity");
    expect(rows.map((r) => r.quantity).sort()).toEqual([0.25, 3]);
  });
});

describe("household caps", () => {
  it("refuses a new bags day with a fractional cap (422 on household_cap)", async () => {
    const res = await call(councilDays.POST as never, await request("/api/council/giveaways", { body: giveawayBody({ unit: "bags", household_cap: 2.5 }), as: council }));
    expect(res.status, JSON.stringify(res.json)).toBe(422);
    expect(res.json.error.fields.household_cap).toMatch(/whole number of bags/);
  });
  it("refuses a new m³ day with a cap past two decimal places", async () => {
    const res = await call(councilDays.POST as never, await request("/api/council/giveaways", { body: giveawayBody({ material: "compost", unit: "m3", household_cap: 0.125 }), as: council }));
    expect(res.status, JSON.stringify(res.json)).toBe(422);
    expect(res.json.error.fields.household_cap).toMatch(/\S/);
  });
  it("refuses changing a bags day's cap to a fraction", async () => {
    const res = await call(councilDay.PATCH as never, await request(`/api/council/giveaways/${bagsDay.id}`, { method: "PATCH", body: { household_cap: 3.5 }, as: council }), { id: bagsDay.id });
    expect(res.status, JSON.stringify(res.json)).toBe(422);
    expect(res.json.error.fields.household_cap).toMatch(/whole number of bags/);
    expect((await ctx.db("giveaway_days").where({ id: bagsDay.id }).first("household_cap")).household_cap).toBe(6);
  });
  it("accepts a whole-bag change", async () => {
    const res = await call(councilDay.PATCH as never, await request(`/api/council/giveaways/${bagsDay.id}`, { method: "PATCH", body: { household_cap: 4 }, as: council }), { id: bagsDay.id });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
  });
});
