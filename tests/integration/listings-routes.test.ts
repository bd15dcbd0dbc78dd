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
  who.colleague = (await createUser({ roles: ["council"], orgId: council.orgId })).id;
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

  it("only growers may list live worms", async () => {
    const body = listingBody({ material: "worms", unit: "kg", quantity: 2, quality: { species: "Eisenia fetida" }, title: "Red wigglers" });
    const supplier = await call(listings.POST as never, await request("/api/listings", { as: who.owner, body }));
    expect(supplier.status).toBe(403);
    const grower = await call(listings.POST as never, await request("/api/listings", { as: who.grower, body }));
    expect(grower.status).toBe(201);
  });
});
