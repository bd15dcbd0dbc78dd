// A listing's dates bind reserving: nothing can be held after its end date (even before the
// worker has marked it expired) or before its start date. Browse shows a listing ahead of its
// start, saying from when; matching offers only what can be reserved now.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser, listingQuantities } from "../factories";
import { POST as reserve } from "@/app/api/reservations/route";
import { GET as browse } from "@/app/api/listings/route";
import { findCandidates } from "@/db/match-candidates";
import { db } from "@/db/index";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let gardener: { id: string };

beforeAll(async () => {
  ctx = await freshDb();
  gardener = await createUser({ roles: ["gardener"] });
});
afterAll(() => ctx.close());

const days = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString();
const post = async (body: unknown) => call(reserve, await request("/api/reservations", { body, as: gardener.id }));
async function listing(dates: { available_from?: string | null; available_until?: string | null }) {
  return createListing({ quantity_total: 6, ...dates });
}
const heldOn = async (id: string) => (await listingQuantities(id)).quantity_held;
const reservationsOn = (id: string) => db()("reservations").where({ listing_id: id });

describe("reserving within a listing's dates", () => {
  it("refuses a listing past its end date, though the worker has not marked it expired yet", async () => {
    const l = await listing({ available_until: days(-0.1) });
    expect((await db()("listings").first("status").where({ id: l.id })).status).toBe("active");
    const res = await post({ listing_id: l.id, quantity: 1 });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("invalid_state");
    expect(res.json.error.message).toMatch(/ended on .*not taking reservations/);
    expect(await heldOn(l.id)).toBe(0);
    expect(await reservationsOn(l.id)).toHaveLength(0);
  });

  it("refuses a listing before its start date, naming the day, and takes it once that has come", async () => {
    const l = await listing({ available_from: "2099-04-01T00:00:00.000Z" });
    const early = await post({ listing_id: l.id, quantity: 2 });
    expect(early.status).toBe(409);
    expect(early.json.error).toMatchObject({ code: "invalid_state" });
    expect(early.json.error.message).toContain("can be reserved from 1 April 2099");
    expect(await heldOn(l.id)).toBe(0);

    await db()("listings").where({ id: l.id }).update({ available_from: days(-1), available_until: days(10) });
    const now = await post({ listing_id: l.id, quantity: 2 });
    expect(now.status).toBe(201);
    expect(await heldOn(l.id)).toBe(2);
  });

  it("makes Reserve all fail as a whole when one listing has not started", async () => {
    const open = await listing({});
    const later = await listing({ available_from: days(3) });
    const res = await post({ items: [{ listing_id: open.id, quantity: 1 }, { listing_id: later.id, quantity: 1 }] });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("invalid_state");
    expect(await heldOn(open.id)).toBe(0);
    expect(await heldOn(later.id)).toBe(0);
  });
});

describe("browse and matching agree with reserving", () => {
  it("browse lists a listing ahead of its start with reservable_from; matching leaves it out until then", async () => {
    await db()("listings").update({ status: "archived" }); // only this test's listings below
    const open = await listing({ available_from: days(-2) });
    const laterFrom = days(3);
    const later = await listing({ available_from: laterFrom });
    const ended = await listing({ available_until: days(-0.1) });
    const res = await call(browse as never, await request("/api/listings?lat=52.202&lng=0.852&radius_km=5&limit=50", { method: "GET" }));
    expect(res.status).toBe(200);
    const byId = new Map<string, any>(res.json.items.map((i: any) => [i.id, i]));
    expect([...byId.keys()].sort()).toEqual([open.id, later.id].sort());
    expect(byId.get(later.id).reservable_from).toBe(laterFrom);
    expect(byId.get(open.id).reservable_from).toBeNull();
    expect(byId.has(ended.id)).toBe(false);

    const found = await findCandidates({ origin: { lat: 52.202, lng: 0.852 }, radius_km: 5, materials: ["leaves"] });
    expect(found.map((c) => c.id)).toEqual([open.id]);
    const inFourDays = await findCandidates({ origin: { lat: 52.202, lng: 0.852 }, radius_km: 5, materials: ["leaves"], now: new Date(Date.now() + 4 * 86_400_000) });
    expect(inFourDays.map((c) => c.id).sort()).toEqual([open.id, later.id].sort());
  });
});
