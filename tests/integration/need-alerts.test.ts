// Alerts: a listing posted, restocked or come into its dates reaches every open need it could
// serve (its material, a unit it can be measured in, within the need's own radius by Turf's
// exact distance, dated on or after the day it can be reserved), once per need and listing;
// e-mails at once or in a digest at most once a day; needs met through reservations, and
// expired when their day passes.
import { destination, distance, point } from "@turf/turf";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser, listingBody } from "../factories";
import { insertBed } from "@/db/beds";
import { addDays } from "@/lib/time/zoned";
import { alertDueListings } from "@/lib/services/needs/alert-due-listings";
import { sendNeedDigests } from "@/lib/services/needs/send-need-digests";
import { expireOpenNeeds } from "@/lib/services/needs/close-needs";
import { needsReaching } from "@/lib/needs/reaching";
import { isPg, queryPlan } from "../helpers/engine";
import { renderedRows } from "../helpers/outbox";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const listings = await import("@/app/api/listings/route");
const oneListing = await import("@/app/api/listings/[id]/route");
const status = await import("@/app/api/listings/[id]/status/route");
const needs = await import("@/app/api/needs/route");
const oneNeed = await import("@/app/api/needs/[id]/route");
const reservations = await import("@/app/api/reservations/route");
const cancel = await import("@/app/api/reservations/[id]/cancel/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
const who: Record<string, string> = {};
const today = new Date().toISOString().slice(0, 10);
const START = addDays(today, 10);
let listingId = "";
let A = { lat: 0, lng: 0 }; // the listing's public point
let bedId = "";
let reservable = "";

/** A point `km` from the listing's public point, on a bearing (degrees from north). */
const from = (km: number, bearing: number, p = A) => {
  const [lng, lat] = destination(point([p.lng, p.lat]), km, bearing, { units: "kilometers" }).geometry.coordinates;
  return { lat, lng };
};

async function openNeed(as: string, body: Record<string, unknown>) {
  const res = await call(needs.POST as never, await request("/api/needs", { as, body: { material: "leaves", quantity: 0.4, unit: "m3", needed_by: addDays(today, 60), ...body } }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return res.json.need.id as string;
}
const alertsFor = async (listing: string) => (await ctx.db("need_alerts").where({ listing_id: listing }).pluck("need_id")).sort();
const mails = (to: string, template?: string) => renderedRows(ctx.db("email_outbox").where({ to_address: to, ...(template ? { template } : {}) }).orderBy("created_at"));
const emailOf = async (id: string) => (await ctx.db("users").first("email").where({ id })).email as string;

const n: Record<string, string> = {};

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  for (const k of ["ines", "bo", "cy", "dee", "ed"]) who[k] = (await createUser({ roles: ["gardener"] })).id;
  who.supplier = (await createUser({ roles: ["gardener", "supplier"] })).id;
  // A draft first, to learn its public point before anyone's need is placed around it.
  const res = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ status: "draft", quantity: 10, available_from: START, auto_accept: true }) }));
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  listingId = res.json.listing.id;
  A = res.json.listing.location;
  bedId = await insertBed(who.ines, { name: "Quince corner", shape: JSON.stringify({ length_m: 3, width_m: 1.2 }), area_m2: 3.6, ...from(3, 0), recipe: "{}", start_date: addDays(today, 40) });

  n.inesBed = await openNeed(who.ines, { bed_id: bedId, radius_km: 5, alerts: "immediate" }); // 3 km away, inside
  n.boOutside = await openNeed(who.bo, { location: from(5.2, 90), radius_km: 5 }); // outside its own radius
  n.cyFar = await openNeed(who.cy, { location: from(9.9, 180), radius_km: 10 }); // inside, in the 10 km band
  n.deeCardboard = await openNeed(who.dee, { material: "cardboard", quantity: 3, unit: "m2", location: from(1, 45), radius_km: 10 });
  // Turf decides at the edge: the same distance, radii a few metres either side of it.
  const edge = from(4, 270);
  const km = distance(point([edge.lng, edge.lat]), point([A.lng, A.lat]), { units: "kilometers" });
  n.edgeIn = await openNeed(who.ed, { location: edge, radius_km: km + 0.005 });
  n.edgeOut = await openNeed(who.dee, { location: edge, radius_km: km - 0.005 });
  n.ownNeed = await openNeed(who.supplier, { location: from(1, 10), radius_km: 5 }); // the supplier's own
  n.closed = await openNeed(who.bo, { location: from(1, 200), radius_km: 5 });
  await call(oneNeed.PATCH as never, await request(`/api/needs/${n.closed}`, { method: "PATCH", as: who.bo, body: { status: "closed" } }), { id: n.closed });
  n.tooEarly = await openNeed(who.cy, { location: from(2, 300), radius_km: 5, needed_by: addDays(START, -1) }); // over before it can be reserved
  n.onTheDay = await openNeed(who.bo, { location: from(2, 120), radius_km: 5, needed_by: START, alerts: "daily" });
});
afterAll(() => ctx.close());

describe("a listing published", () => {
  it("alerts exactly the open needs it could serve, and tells the supplier how many gardeners", async () => {
    const res = await call(status.POST as never, await request(`/api/listings/${listingId}/status`, { as: who.supplier, body: { action: "publish" } }), { id: listingId });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(await alertsFor(listingId)).toEqual([n.inesBed, n.cyFar, n.edgeIn, n.onTheDay].sort());
    expect(res.json.listing.matched_gardeners).toBe(4); // ines, cy, ed, bo
    const row = await ctx.db("need_alerts").first().where({ need_id: n.inesBed, listing_id: listingId });
    expect(row.distance_km).toBeCloseTo(3, 2);
    expect(row.delivery).toBe("immediate");
  });

  it("looks needs up through the index, a box per reach band, never the whole table", async () => {
    // PostgreSQL plans from statistics and reads a table of a few rows whole, index or not:
    // give it a county's worth of open needs (gone again afterwards).
    const crowd: string[] = [];
    if (isPg(ctx.db)) {
      const rows = Array.from({ length: 6000 }, (_, i) => {
        const at = from(((i * 7919) % 40_000) / 1000, (i * 37) % 360);
        const id = crypto.randomUUID();
        crowd.push(id);
        const material_code = ["leaves", "cardboard", "straw", "compost"][i % 4];
        return { id, owner_id: who.bo, material_code, quantity: 1, unit: material_code === "cardboard" ? "m2" : "m3", radius_km: 5, reach_km: [2, 5, 10, 25, 50][i % 5], ...at, needed_by: addDays(today, 30), alerts: "daily", status: i % 10 ? "open" : "closed", created_at: new Date().toISOString(), updated_at: new Date().toISOString() };
      });
      await ctx.db.batchInsert("needs", rows, 500);
      await ctx.db.raw("ANALYZE needs");
    }
    try {
      const seen: { sql: string; bindings: unknown[] }[] = [];
      const listen = (q: { sql: string; bindings: unknown[] }) => seen.push(q);
      ctx.db.on("query", listen);
      await needsReaching({ id: "x", owner_id: "nobody", material: "leaves", unit: "bags", unit_size: 0.07, unit_mass_kg: null, location: A, from_day: today }, ctx.db);
      ctx.db.removeListener("query", listen);
      expect(seen.length).toBe(5);
      for (const q of seen) {
        const plan = await queryPlan(ctx.db, q.sql, q.bindings);
        if (isPg(ctx.db)) {
          expect(plan).toMatch(/needs_near/);
          expect(plan).not.toMatch(/Seq Scan on needs/);
        } else {
          expect(plan).toMatch(/SEARCH needs USING INDEX needs_reach_box \(status=\? AND material_code=\? AND reach_km=\? AND lat>\? AND lat<\?\)/);
          expect(plan).not.toMatch(/SCAN needs/);
        }
      }
    } finally {
      for (let i = 0; i < crowd.length; i += 500) await ctx.db("needs").whereIn("id", crowd.slice(i, i + 500)).delete();
    }
  });

  it("e-mails an immediate alert at once, naming the bed, and keeps the daily ones for the digest", async () => {
    const ines = await mails(await emailOf(who.ines), "need.alert");
    expect(ines).toHaveLength(1);
    expect(ines[0].subject).toContain("Quince corner");
    expect(ines[0].text_body).toMatch(/\/needs\/alerts\/[0-9a-f-]{36}/);
    // The leaves caution goes with it, and never the supplier's address.
    expect(ines[0].text_body).toMatch(/roadside/);
    expect(ines[0].text_body).not.toContain("Test Lane");
    expect(await mails(await emailOf(who.cy))).toHaveLength(0);
  });

  it("alerts nobody twice when it is checked again", async () => {
    const before = await ctx.db("need_alerts").count({ n: "*" });
    await ctx.db("listings").where({ id: listingId }).update({ needs_due_at: "1970-01-01T00:00:00.000Z" });
    await alertDueListings({ clock: () => new Date(), db: ctx.db });
    expect(await ctx.db("need_alerts").count({ n: "*" })).toEqual(before);
    expect(await mails(await emailOf(who.ines), "need.alert")).toHaveLength(1);
  });
});

describe("restocked, come into its dates, a hold returned", () => {
  it("notices a need opened since at once, and reaches one opened while it was spoken for when the supplier adds more", async () => {
    n.later = await openNeed(who.dee, { location: from(1.5, 60), radius_km: 5 });
    // Listings already on offer are noticed as a need is opened (need-notices.test.ts).
    expect(await alertsFor(listingId)).toContain(n.later);
    expect(await ctx.db("need_alerts").where({ listing_id: listingId }).count({ n: "*" })).toEqual([{ n: 5 }]);

    const small = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ quantity: 2, title: "Two bags of birch" }) }));
    const id = small.json.listing.id as string;
    const held = await call(reservations.POST as never, await request("/api/reservations", { as: who.cy, body: { listing_id: id, quantity: 2 } }));
    expect(held.status, JSON.stringify(held.json)).toBe(201);
    n.spokenFor = await openNeed(who.dee, { location: from(0.5, 90, small.json.listing.location), radius_km: 3 });
    expect(await alertsFor(id)).not.toContain(n.spokenFor);
    const res = await call(oneListing.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.supplier, body: { quantity: 5 } }), { id });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(await alertsFor(id)).toContain(n.spokenFor);
  });

  it("reaches a need opened while it waited for its start date, on that date", async () => {
    n.waiting = await openNeed(who.ed, { material: "leaves", location: from(2.5, 330), radius_km: 5 });
    // As a need written straight into the database (a seed, an import) would be: not noticed on opening.
    await ctx.db("need_alerts").where({ need_id: n.waiting }).delete();
    // Nothing changed on the listing, and its start date is still to come.
    await alertDueListings({ clock: () => new Date(), db: ctx.db });
    expect(await alertsFor(listingId)).not.toContain(n.waiting);
    await alertDueListings({ clock: () => new Date(`${START}T00:01:00Z`), db: ctx.db });
    expect(await alertsFor(listingId)).toContain(n.waiting);
  });

  it("reaches a need opened while it was all spoken for, once a hold comes back", async () => {
    const small = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ quantity: 2 }) }));
    const id = small.json.listing.id as string;
    const held = await call(reservations.POST as never, await request("/api/reservations", { as: who.cy, body: { listing_id: id, quantity: 2 } }));
    expect(held.status, JSON.stringify(held.json)).toBe(201);
    expect((await ctx.db("listings").first("status").where({ id })).status).toBe("gone");
    n.whileGone = await openNeed(who.bo, { location: from(0.5, 0, small.json.listing.location), radius_km: 3 });
    await alertDueListings({ clock: () => new Date(), db: ctx.db });
    expect(await alertsFor(id)).not.toContain(n.whileGone);
    const rid = held.json.reservation.id;
    expect((await call(cancel.POST as never, await request(`/api/reservations/${rid}/cancel`, { as: who.cy, body: {} }), { id: rid })).status).toBe(200);
    await alertDueListings({ clock: () => new Date(), db: ctx.db });
    expect(await alertsFor(id)).toContain(n.whileGone);
  });

  it("alerts nobody for a paused or hidden listing", async () => {
    const res = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ status: "draft" }) }));
    const id = res.json.listing.id as string;
    await ctx.db("listings").where({ id }).update({ status: "paused", needs_due_at: "1970-01-01T00:00:00.000Z" });
    await alertDueListings({ clock: () => new Date(), db: ctx.db });
    expect(await alertsFor(id)).toEqual([]);
    expect((await ctx.db("listings").first("needs_due_at").where({ id })).needs_due_at).toBeNull();
  });
});

describe("the daily digest", () => {
  it("sends one e-mail with every daily alert, then waits a day before the next", async () => {
    const cy = await emailOf(who.cy);
    const t0 = new Date();
    expect(await sendNeedDigests({ clock: () => t0, db: ctx.db })).toBeGreaterThan(0);
    const first = await mails(cy, "need.digest");
    expect(first).toHaveLength(1);
    expect(first[0].text_body).toMatch(/\/needs\/alerts\/[0-9a-f-]{36}/);
    expect(await sendNeedDigests({ clock: () => t0, db: ctx.db })).toBe(0);

    // A new daily alert for cy: not before a day has passed since the last digest.
    const other = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ title: "Hornbeam leaves", location: from(9, 180) }) }));
    expect(await alertsFor(other.json.listing.id)).toContain(n.cyFar);
    await sendNeedDigests({ clock: () => new Date(t0.getTime() + 3_600_000), db: ctx.db });
    expect(await mails(cy, "need.digest")).toHaveLength(1);
    await sendNeedDigests({ clock: () => new Date(t0.getTime() + 25 * 3_600_000), db: ctx.db });
    const second = (await mails(cy, "need.digest"))[1];
    expect(second.text_body).toContain("Hornbeam leaves");
    expect(second.text_body).not.toContain(first[0].text_body.match(/needs\/alerts\/([0-9a-f-]{36})/)![1]);
  });
});

describe("closing needs", () => {
  it("meets a need through a reservation made from its alert, and opens it again if that is cancelled", async () => {
    const near = await call(oneNeed.GET as never, await request(`/api/needs/${n.edgeIn}`, { as: who.ed }), { id: n.edgeIn });
    const posted = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ title: "Lime leaves by the gate", auto_accept: true, location: near.json.need.location }) }));
    const id = (reservable = posted.json.listing.id as string);
    expect(await alertsFor(id)).toContain(n.edgeIn);
    // 0.4 m³ in bags of 30 US gal (0.1136 m³, NIST gallon) is 3.5 bags: four whole ones.
    const res = await call(reservations.POST as never, await request("/api/reservations", { as: who.ed, body: { listing_id: id, quantity: 4, need_id: n.edgeIn } }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.reservation.status).toBe("confirmed");
    expect((await ctx.db("reservations").first("need_id").where({ id: res.json.reservation.id })).need_id).toBe(n.edgeIn);
    expect((await ctx.db("needs").first("status", "closed_at").where({ id: n.edgeIn })).status).toBe("met");
    const rid = res.json.reservation.id;
    expect((await call(cancel.POST as never, await request(`/api/reservations/${rid}/cancel`, { as: who.ed, body: {} }), { id: rid })).status).toBe(200);
    expect((await ctx.db("needs").first("status").where({ id: n.edgeIn })).status).toBe("open");
  });

  it("refuses a need_id that is someone else's, or for another material", async () => {
    for (const need of [n.inesBed, n.deeCardboard]) {
      const res = await call(reservations.POST as never, await request("/api/reservations", { as: who.dee, body: { listing_id: reservable, quantity: 1, need_id: need } }));
      expect(res.status, JSON.stringify(res.json)).toBe(422);
      expect(res.json.error.fields.need_id).toMatch(/\S/);
    }
  });

  it("counts a bed's own reservations towards its need, and meets it once confirmed", async () => {
    const auto = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ title: "Beech leaves, take what you need", auto_accept: true, quantity: 12, location: from(3, 0) }) }));
    const id = auto.json.listing.id as string;
    const res = await call(reservations.POST as never, await request("/api/reservations", { as: who.ines, body: { items: [{ listing_id: id, quantity: 4 }], bed_id: bedId } }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.reservations[0].status).toBe("confirmed");
    const need = await call(oneNeed.GET as never, await request(`/api/needs/${n.inesBed}`, { as: who.ines }), { id: n.inesBed });
    expect(need.json.need.status).toBe("met");
    expect(need.json.need.quantity_left).toBe(0);
    // The gardener calls it off: the need is open again while its day is still to come.
    const rid = res.json.reservations[0].id;
    expect((await call(cancel.POST as never, await request(`/api/reservations/${rid}/cancel`, { as: who.ines, body: {} }), { id: rid })).status).toBe(200);
    expect((await ctx.db("needs").first("status").where({ id: n.inesBed })).status).toBe("open");
  });

  it("expires open needs once their day has passed", async () => {
    const expired = await expireOpenNeeds({ clock: () => new Date(`${addDays(START, 1)}T00:00:00Z`), db: ctx.db });
    expect(expired).toBeGreaterThanOrEqual(1);
    expect((await ctx.db("needs").first("status", "closed_at").where({ id: n.onTheDay })).status).toBe("expired");
    expect((await ctx.db("needs").first("status").where({ id: n.cyFar })).status).toBe("open");
  });
});

describe("an address nobody has confirmed", () => {
  it("sends no mail to an address nobody has confirmed, and keeps the notice in the app", async () => {
    const unconfirmed = await createUser({ roles: ["gardener"], unconfirmed: true });
    // Far from everyone else's needs, so nobody else's alerts or digests are touched.
    const elsewhere = from(40, 45);
    const need = await openNeed(unconfirmed.id, { location: elsewhere, radius_km: 5, alerts: "immediate" });
    const posted = await call(listings.POST as never, await request("/api/listings", { as: who.supplier, body: listingBody({ title: "Alder leaves", location: elsewhere }) }));
    expect(await alertsFor(posted.json.listing.id)).toContain(need);
    expect(await mails(unconfirmed.email)).toHaveLength(0);
    await sendNeedDigests({ clock: () => new Date(Date.now() + 48 * 3_600_000), db: ctx.db });
    expect(await mails(unconfirmed.email)).toHaveLength(0);
  });
});
