// Listings already on offer when a need is opened (or moved, widened, redated): the nearest
// that could serve it become in-app notices at once, by the same rule as alerts, with no
// e-mail then or in the day's digest.
import { destination, point } from "@turf/turf";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser, listingBody } from "../factories";
import { addDays } from "@/lib/time/zoned";
import { sendNeedDigests } from "@/lib/services/needs/send-need-digests";
import { renderedRows } from "../helpers/outbox";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const listings = await import("@/app/api/listings/route");
const needs = await import("@/app/api/needs/route");
const oneNeed = await import("@/app/api/needs/[id]/route");
const alerts = await import("@/app/api/needs/alerts/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
const who: Record<string, string> = {};
const l: Record<string, { id: string; at: { lat: number; lng: number } }> = {};
const today = new Date().toISOString().slice(0, 10);
const HOME = { lat: 52.2051, lng: 0.8472 };

const from = (km: number, bearing: number, p = HOME) => {
  const [lng, lat] = destination(point([p.lng, p.lat]), km, bearing, { units: "kilometers" }).geometry.coordinates;
  return { lat, lng };
};

async function post(as: string, over: Record<string, unknown>) {
  const res = await call(listings.POST as never, await request("/api/listings", { as, body: listingBody(over) }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return { id: res.json.listing.id as string, at: res.json.listing.location as { lat: number; lng: number } };
}
const noticesOf = async (need: string) => (await ctx.db("need_alerts").where({ need_id: need }).pluck("listing_id")).sort();

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  who.supplier = (await createUser({ roles: ["supplier"] })).id;
  who.ines = (await createUser({ roles: ["gardener", "supplier"] })).id;
  l.near = await post(who.supplier, { title: "Lime leaves", location: from(1, 0) });
  l.further = await post(who.supplier, { title: "Plane leaves", location: from(3, 90) });
  l.far = await post(who.supplier, { title: "Ash leaves", location: from(30, 180) });
  l.cardboard = await post(who.supplier, { material: "cardboard", unit: "m2", quantity: 20, title: "Flat boxes", quality: {}, location: from(1, 180) });
  l.late = await post(who.supplier, { title: "Oak leaves, later", location: from(1, 270), available_from: addDays(today, 90) });
  l.own = await post(who.ines, { title: "My own leaves", location: from(0.5, 45) });
});
afterAll(() => ctx.close());

describe("opening a need where listings are already on offer", () => {
  let need = "";

  it("notices the listings that could serve it, nearest first, and no others", async () => {
    const res = await call(needs.POST as never, await request("/api/needs", { as: who.ines, body: { material: "leaves", quantity: 0.5, unit: "m3", radius_km: 5, needed_by: addDays(today, 30), location: HOME, alerts: "immediate" } }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    need = res.json.need.id;
    // Not the far one, not cardboard, not one that starts after the need's day, not her own.
    expect(await noticesOf(need)).toEqual([l.near.id, l.further.id].sort());
    expect(res.json.need.alert_count).toBe(2);
    const list = await call(alerts.GET as never, await request("/api/needs/alerts", { as: who.ines }));
    expect(list.json.alerts.map((a: { listing: { id: string } }) => a.listing.id)).toEqual(expect.arrayContaining([l.near.id, l.further.id]));
  });

  it("sends no e-mail for them, at once or in the digest", async () => {
    const email = (await ctx.db("users").first("email").where({ id: who.ines })).email;
    expect(await ctx.db("email_outbox").where({ to_address: email })).toHaveLength(0);
    await sendNeedDigests({ clock: () => new Date(Date.now() + 48 * 3_600_000), db: ctx.db });
    expect(await ctx.db("email_outbox").where({ to_address: email })).toHaveLength(0);
  });

  it("notices more when the need goes further, and keeps the notices it had", async () => {
    const before = await ctx.db("need_alerts").where({ need_id: need }).select("id", "listing_id");
    const res = await call(oneNeed.PATCH as never, await request(`/api/needs/${need}`, { method: "PATCH", as: who.ines, body: { radius_km: 40 } }), { id: need });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(await noticesOf(need)).toEqual([l.near.id, l.further.id, l.far.id].sort());
    const after = await ctx.db("need_alerts").where({ need_id: need }).select("id", "listing_id");
    for (const b of before) expect(after).toContainEqual(b);
  });

  it("counts the gardener as matched on the listing", async () => {
    const res = await call((await import("@/app/api/listings/[id]/route")).GET as never, await request(`/api/listings/${l.near.id}`, { as: who.supplier }), { id: l.near.id });
    expect(res.json.listing.matched_gardeners).toBe(1);
  });

  it("keeps the day's digest for what is listed later, as if the notices had not been", async () => {
    const bo = await createUser({ roles: ["gardener"] });
    const res = await call(needs.POST as never, await request("/api/needs", { as: bo.id, body: { material: "leaves", quantity: 0.5, unit: "m3", radius_km: 5, needed_by: addDays(today, 30), location: from(0.5, 0), alerts: "daily" } }));
    expect(res.json.need.alert_count).toBe(3); // lime, plane and Ines's own leaves
    const later = await post(who.supplier, { title: "Hazel leaves", location: from(0.8, 0) });
    expect(await noticesOf(res.json.need.id)).toContain(later.id);
    expect(await sendNeedDigests({ clock: () => new Date(), db: ctx.db })).toBe(1);
    const [digest] = await renderedRows(ctx.db("email_outbox").where({ to_address: bo.email, template: "need.digest" }));
    expect(digest.text_body).toContain("Hazel leaves");
    expect(digest.text_body).not.toContain("Lime leaves");
  });
});
