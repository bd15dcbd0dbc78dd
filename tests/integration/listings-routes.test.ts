// The listing routes end to end against a fresh database: who may call what (anonymous 401,
// gardener 403, someone else's listing 404), bad input with a message per field, the status
// machine, and quantities that can never go negative.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser, listingBody } from "../factories";

process.env.CLOUDINARY_URL = "cloudinary://k:s@duffbank-local?upload_prefix=http://127.0.0.1:9";
const listings = await import("@/app/api/listings/route");
const one = await import("@/app/api/listings/[id]/route");
const status = await import("@/app/api/listings/[id]/status/route");
const photos = await import("@/app/api/listings/[id]/photos/route");
const sign = await import("@/app/api/media/sign/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
const who: Record<string, string> = {};
let listingId = "";

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  who.gardener = (await createUser({ roles: ["gardener"] })).id;
  who.owner = (await createUser({ roles: ["gardener", "supplier"] })).id;
  who.other = (await createUser({ roles: ["supplier"] })).id;
  who.grower = (await createUser({ roles: ["grower"] })).id;
  const council = await createUser({ roles: ["council"] });
  who.council = council.id;
  who.colleague = (await createUser({ roles: ["council"], organisation_id: council.organisation_id })).id;
  const res = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body: listingBody() }));
  expect(res.status).toBe(201);
  listingId = res.json.listing.id;
});
afterAll(() => ctx.close());

const photo = { public_id: "listings/x/abc", version: 1, signature: "0".repeat(40), width: 10, height: 10, format: "jpg" };

// Every route that changes a listing, with a body that is valid in shape.
const WRITE_ROUTES = () => [
  { name: "PATCH /api/listings/<id>", handler: one.PATCH, method: "PATCH", url: `/api/listings/${listingId}`, body: { title: "Changed title" } },
  { name: "POST /api/listings/<id>/status", handler: status.POST, method: "POST", url: `/api/listings/${listingId}/status`, body: { action: "pause" } },
  { name: "POST /api/listings/<id>/photos", handler: photos.POST, method: "POST", url: `/api/listings/${listingId}/photos`, body: { photos: [photo] } },
  { name: "DELETE /api/listings/<id>/photos", handler: photos.DELETE, method: "DELETE", url: `/api/listings/${listingId}/photos`, body: { photo_id: "nope" } },
  { name: "PATCH /api/listings/<id>/photos", handler: photos.PATCH, method: "PATCH", url: `/api/listings/${listingId}/photos`, body: { order: ["nope"] } },
];

describe("who may call the listing routes", () => {
  it("POST /api/listings: anonymous 401, gardener 403, supplier/grower/council 201", async () => {
    const anon = await call(listings.POST as never, await request("/api/listings", { body: listingBody() }));
    expect(anon.status).toBe(401);
    expect(anon.json.error.code).toBe("unauthenticated");
    const gardener = await call(listings.POST as never, await request("/api/listings", { as: who.gardener, body: listingBody() }));
    expect(gardener.status).toBe(403);
    expect(gardener.json.error.code).toBe("forbidden");
    for (const as of [who.other, who.grower, who.council]) {
      const res = await call(listings.POST as never, await request("/api/listings", { as, body: listingBody() }));
      expect(res.status).toBe(201);
    }
  });

  it("POST /api/media/sign: anonymous 401, gardener 403, supplier 200", async () => {
    expect((await call(sign.POST as never, await request("/api/media/sign", { method: "POST" }))).status).toBe(401);
    expect((await call(sign.POST as never, await request("/api/media/sign", { method: "POST", as: who.gardener }))).status).toBe(403);
    const ok = await call(sign.POST as never, await request("/api/media/sign", { method: "POST", as: who.owner }));
    expect(ok.status).toBe(200);
    expect(ok.json).toMatchObject({ folder: `listings/${who.owner}`, cloud_name: "duffbank-local", api_key: "k" });
    expect(ok.json.signature).toMatch(/^[0-9a-f]{40}$/);
    expect(ok.json.upload_url).toBe("http://127.0.0.1:9/v1_1/duffbank-local/image/upload");
  });

  for (const [label, as, expected] of [
    ["anonymous", null, 401],
    ["a gardener", "gardener", 403],
    ["another supplier", "other", 404],
    ["a council member of another organisation", "council", 404],
  ] as const) {
    it(`${label} → ${expected} on every write route, and the listing is untouched`, async () => {
      for (const r of WRITE_ROUTES()) {
        const res = await call(r.handler as never, await request(r.url, { method: r.method, as: as ? who[as] : null, body: r.body }), { id: listingId });
        expect(res.status, r.name).toBe(expected);
        expect(res.json.error.code, r.name).toBe({ 401: "unauthenticated", 403: "forbidden", 404: "not_found" }[expected]);
      }
      const row = await ctx.db("listings").where({ id: listingId }).first();
      expect(row.title).toBe("Bagged oak leaves");
      expect(row.status).toBe("active");
    });
  }

  it("a colleague in the same organisation may manage a council listing", async () => {
    const made = await call(listings.POST as never, await request("/api/listings", { as: who.council, body: listingBody({ title: "Park leaf pile" }) }));
    const id = made.json.listing.id;
    const res = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.colleague, body: { title: "Park leaf pile, load your own" } }), { id });
    expect(res.status).toBe(200);
    expect(res.json.listing.title).toBe("Park leaf pile, load your own");
    expect(res.json.listing.pickup.address).toBe("7 Test Lane, Fernhollow");
    const paused = await call(status.POST as never, await request(`/api/listings/${id}/status`, { as: who.colleague, body: { action: "pause" } }), { id });
    expect(paused.json.listing.status).toBe("paused");
  });

  it("takes leaves in bales that say how big they are", async () => {
    const res = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body: listingBody({ unit: "bales", quantity: 3, unit_size: 0.25 }) }));
    expect(res.status).toBe(201);
    expect(res.json.listing).toMatchObject({ unit: "bales", unit_size: 0.25 });
  });

  it("only growers may list live worms", async () => {
    const body = listingBody({ material: "worms", unit: "kg", quantity: 2, quality: { species: "Eisenia fetida" }, title: "Red wigglers" });
    const supplier = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body }));
    expect(supplier.status).toBe(403);
    const grower = await call(listings.POST as never, await request("/api/listings", { as: who.grower, body }));
    expect(grower.status).toBe(201);
  });

  it("a culture says at creation whether it is posted, collected or both", async () => {
    const body = listingBody({ material: "worms", unit: "kg", quantity: 1, quality: { species: "Eisenia fetida", ships: true, pickup: false }, title: "Posted wigglers" });
    const res = await call(listings.POST as never, await request("/api/listings", { as: who.grower, body }));
    expect(res.status).toBe(201);
    expect(res.json.listing.quality).toMatchObject({ ships: true, pickup: false });
  });
});

describe("bad input gets a 4xx with a message on the field", () => {
  const BAD: [string, Record<string, unknown>, string][] = [
    ["unknown material", { material: "gravel" }, "material"],
    ["a unit the material is not sold by", { unit: "kg" }, "unit"],
    ["straw by the cubic metre", { material: "straw", unit: "m3", quality: { herbicide_history: "unknown" } }, "unit"],
    ["half a bag", { quantity: 2.5 }, "quantity"],
    ["no quantity", { quantity: 0 }, "quantity"],
    ["a negative price", { price_cents: -100 }, "price_cents"],
    ["a price in euros, not cents", { price_cents: 4.5 }, "price_cents"],
    ["a deposit over the cap", { deposit_cents: 100_000 }, "deposit_cents"],
    ["no pickup point", { location: undefined }, "location"],
    ["a latitude off the globe", { location: { lat: 95, lng: 0 } }, "location.lat"],
    ["no address", { address: "" }, "address"],
    ["a window ending before it starts", { pickup_windows: [{ kind: "weekly", weekday: 2, start_time: "18:00", end_time: "17:00" }] }, "pickup_windows.0.end_time"],
    ["an end date before the start", { available_from: "2027-03-10", available_until: "2027-03-01" }, "available_until"],
    ["an end date already past", { available_until: "2020-01-01" }, "available_until"],
    ["leaves without their source", { quality: {} }, "quality.leaf_source"],
    ["a declaration for another material", { quality: { leaf_source: "garden", tape_removed: true } }, "quality"],
    ["worms without a species", { material: "worms", unit: "kg", quantity: 1, quality: {} }, "quality.species"],
    ["a culture neither posted nor collected", { material: "worms", unit: "kg", quantity: 1, quality: { species: "Eisenia fetida", ships: false, pickup: false } }, "quality.ships"],
    ["straw without its spray history", { material: "straw", unit: "bales", quantity: 4, quality: {} }, "quality.herbicide_history"],
    ["half a bag per person", { max_per_reservation: 1.5 }, "max_per_reservation"],
    ["a bale weight on bags", { unit_mass_kg: 20 }, "unit_mass_kg"],
    ["leaves in bales of no stated size (only straw bales have a usual size)", { unit: "bales", quantity: 3 }, "unit_size"],
    ["seven photos", { photos: Array.from({ length: 7 }, () => photo) }, "photos"],
  ];
  for (const [label, change, field] of BAD) {
    it(`422 for ${label}, with a message on ${field}`, async () => {
      const as = change.material === "worms" ? who.grower : who.owner;
      const res = await call(listings.POST as never, await request("/api/listings", { as, body: listingBody(change) }));
      expect(res.status).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields[field], JSON.stringify(res.json.error.fields)).toMatch(/\S/);
    });
  }
  it("400 for a body that is not JSON, and for an unknown action", async () => {
    expect((await call(listings.POST as never, await request("/api/listings", { as: who.owner, rawBody: "title=x" }))).status).toBe(400);
    const res = await call(status.POST as never, await request(`/api/listings/${listingId}/status`, { as: who.owner, body: { action: "delete" } }), { id: listingId });
    expect(res.status).toBe(422);
    expect(res.json.error.fields.action).toMatch(/\S/);
  });
  it("PATCH refuses unknown fields and changing the material", async () => {
    const res = await call(one.PATCH as never, await request(`/api/listings/${listingId}`, { method: "PATCH", as: who.owner, body: { material: "straw" } }), { id: listingId });
    expect(res.status).toBe(422);
  });
  it("the browse query: 422 per field", async () => {
    for (const [qs, field] of [
      ["lat=52", "lng"],
      ["lat=abc&lng=1", "lat"],
      ["radius_km=5", "radius_km"],
      ["lat=52&lng=0.8&radius_km=900", "radius_km"],
      ["material=gravel", "material"],
      ["limit=0", "limit"],
      ["limit=500", "limit"],
      ["free=maybe", "free"],
      ["cursor=not-a-cursor", "cursor"],
    ]) {
      const res = await call(listings.GET as never, await request(`/api/listings?${qs}`));
      expect(res.status, qs).toBe(422);
      expect(res.json.error.fields[field], qs).toMatch(/\S/);
    }
  });
  it("GET /api/listings/<id> is 404 for an id that does not exist", async () => {
    const res = await call(one.GET as never, await request("/api/listings/missing"), { id: "missing" });
    expect(res.status).toBe(404);
    expect(res.json.error.code).toBe("not_found");
  });
});

describe("editing and the status machine", () => {
  const act = async (id: string, action: string, as = who.owner) =>
    call(status.POST as never, await request(`/api/listings/${id}/status`, { as, body: { action } }), { id });
  const make = async (body: Record<string, unknown> = {}) =>
    (await call(listings.POST as never, await request("/api/listings", { as: who.owner, body: listingBody(body) }))).json.listing.id as string;

  it("draft → active ↔ paused → archived; a draft is not public", async () => {
    const id = await make({ status: "draft" });
    expect((await call(one.GET as never, await request(`/api/listings/${id}`), { id })).status).toBe(404);
    expect((await call(one.GET as never, await request(`/api/listings/${id}`, { as: who.owner }), { id })).json.listing.status).toBe("draft");
    expect((await act(id, "resume")).status).toBe(409);
    expect((await act(id, "publish")).json.listing.status).toBe("active");
    expect((await act(id, "publish")).json.listing.status).toBe("active"); // asking again changes nothing
    expect((await act(id, "pause")).json.listing.status).toBe("paused");
    expect((await call(one.GET as never, await request(`/api/listings/${id}`), { id })).json.listing.status).toBe("paused");
    expect((await act(id, "resume")).json.listing.status).toBe("active");
    expect((await act(id, "archive")).json.listing.status).toBe("archived");
    const again = await act(id, "resume");
    expect(again.status).toBe(409);
    expect(again.json.error.code).toBe("invalid_state");
    expect((await call(one.GET as never, await request(`/api/listings/${id}`), { id })).status).toBe(404);
    const edit = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { title: "Revived" } }), { id });
    expect(edit.status).toBe(409);
    const log = await ctx.db("audit_log").where({ subject_type: "listing", subject_id: id }).orderBy("id").pluck("action");
    expect(log).toEqual(["listing.create", "listing.publish", "listing.pause", "listing.resume", "listing.archive"]);
  });

  it("turns gone when nothing is left and back when a hold is released", async () => {
    const id = await make({ quantity: 4 });
    await ctx.db("listings").where({ id }).update({ quantity_held: 1, quantity_collected: 3 });
    expect((await ctx.db("listings").where({ id }).first()).status).toBe("gone");
    const browse = await call(listings.GET as never, await request("/api/listings?limit=100"));
    expect(browse.json.items.map((i: { id: string }) => i.id)).not.toContain(id);
    await ctx.db("listings").where({ id }).update({ quantity_held: 0 });
    expect((await ctx.db("listings").where({ id }).first()).status).toBe("active");
  });

  it("refuses to archive while something is on hold", async () => {
    const id = await make({ quantity: 4 });
    await ctx.db("listings").where({ id }).update({ quantity_held: 2 });
    const res = await act(id, "archive");
    expect(res.status).toBe(409);
    expect(res.json.error.message).toMatch(/on hold/);
  });

  it("expires after its end date: at once in every read, and in the row when the worker runs", async () => {
    const id = await make({ available_until: "2099-01-01" });
    await ctx.db("listings").where({ id }).update({ available_until: "2021-01-01T00:00:00.000Z" });
    const detail = await call(one.GET as never, await request(`/api/listings/${id}`), { id });
    expect(detail.json.listing.status).toBe("expired");
    const browse = await call(listings.GET as never, await request("/api/listings?limit=100"));
    expect(browse.json.items.map((i: { id: string }) => i.id)).not.toContain(id);
    expect((await act(id, "resume")).status).toBe(409);
    const { expireListings } = await import("@/lib/services/listings/expire-listings");
    expect(await expireListings()).toBeGreaterThanOrEqual(1);
    expect((await ctx.db("listings").where({ id }).first()).status).toBe("expired");
    // A later end date, then resume, puts it back on offer.
    const edit = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { available_until: "2099-06-30" } }), { id });
    expect(edit.status).toBe(200);
    expect((await act(id, "resume")).json.listing.status).toBe("active");
  });

  it("edits keep the rules of a new listing and recompute the public point", async () => {
    const id = await make();
    const before = await ctx.db("listings").where({ id }).first();
    const res = await call(
      one.PATCH as never,
      await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { unit: "m3", quantity: 1.5, location: { lat: 52.21, lng: 0.85 }, address: "9 Moved Row" } }),
      { id },
    );
    expect(res.status).toBe(200);
    const after = await ctx.db("listings").where({ id }).first();
    expect([after.unit, after.quantity_total, after.unit_size, after.address]).toEqual(["m3", 1.5, null, "9 Moved Row"]);
    expect([after.approx_lat, after.approx_lng]).not.toEqual([before.approx_lat, before.approx_lng]);
    const bad = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { unit: "sheets" } }), { id });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.unit).toMatch(/\S/);
  });

  it("keeps a pickup window's row when it is unchanged", async () => {
    const id = await make();
    const [w] = await ctx.db("pickup_windows").where({ listing_id: id });
    const windows = [
      { kind: "weekly", weekday: 6, start_time: "09:00", end_time: "12:00" },
      { kind: "dated", starts_at: "2027-03-14T10:00:00Z", ends_at: "2027-03-14T13:00:00Z" },
    ];
    await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { pickup_windows: windows } }), { id });
    const rows = await ctx.db("pickup_windows").where({ listing_id: id });
    expect(rows).toHaveLength(2);
    expect(rows.map((r: { id: string }) => r.id)).toContain(w.id);
  });
});

describe("quantity available is never negative", () => {
  it("a total below what is held or collected is refused, whoever tries", async () => {
    const made = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body: listingBody({ quantity: 10 }) }));
    const id = made.json.listing.id;
    await ctx.db("listings").where({ id }).update({ quantity_held: 4, quantity_collected: 3 });
    const res = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { quantity: 6 } }), { id });
    expect(res.status).toBe(422);
    expect(res.json.error.fields.quantity).toMatch(/7 bags/);
    expect((await ctx.db("listings").where({ id }).first()).quantity_total).toBe(10);
    // The database refuses it too, whatever code path tries.
    await expect(ctx.db("listings").where({ id }).update({ quantity_total: 6 })).rejects.toThrow(/quantity/);
    await expect(ctx.db("listings").where({ id }).update({ quantity_held: 8 })).rejects.toThrow(/quantity/);
    const ok = await call(one.PATCH as never, await request(`/api/listings/${id}`, { method: "PATCH", as: who.owner, body: { quantity: 7 } }), { id });
    expect(ok.status).toBe(200);
    expect(ok.json.listing.quantity_available).toBe(0);
    expect(ok.json.listing.status).toBe("gone");
  });

  it("concurrent shrinking and holding never leave held + collected above the total", async () => {
    const made = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body: listingBody({ quantity: 20 }) }));
    const id = made.json.listing.id;
    const { setQuantityTotal } = await import("@/db/listings");
    // Holds the way a reservation takes them: a conditional update.
    const hold = () =>
      ctx.db("listings").where({ id }).andWhereRaw("quantity_total - quantity_held - quantity_collected >= ?", [1]).increment("quantity_held", 1);
    await Promise.all([...Array.from({ length: 15 }, hold), setQuantityTotal(id, 12), ...Array.from({ length: 15 }, hold)]);
    const row = await ctx.db("listings").where({ id }).first();
    expect(row.quantity_held + row.quantity_collected).toBeLessThanOrEqual(row.quantity_total);
    expect(row.quantity_total - row.quantity_held - row.quantity_collected).toBeGreaterThanOrEqual(0);
  });
});
