// Listing photos through the app's own flow against the local Cloudinary fake: the app signs,
// the "browser" posts the file straight to the fake, the app verifies the upload's signature
// before keeping it, and pages get delivery URLs built with next-cloudinary's helper.
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser, listingBody } from "../factories";
import { startCloudinaryFake, type CloudinaryFake } from "@/lib/fakes/cloudinary/server";
import { MAX_UPLOAD_BYTES } from "@/lib/media/image-limits";
import { exifHasGps, HTML, jpegWithPrivateMetadata, noisy, solid, SVG } from "../unit/media/image-fixtures";

const KEY = "photo_key";
const SECRET = "photo_secret";
const CLOUD = "duffbank-local";

// The fake's port must be in CLOUDINARY_URL before the app's Cloudinary module (and so the
// SDK) is first imported: the SDK reads it once, at load.
const fake: CloudinaryFake = await startCloudinaryFake({ port: 0, apiKey: KEY, apiSecret: SECRET, cloudName: CLOUD });
process.env.CLOUDINARY_URL = `cloudinary://${KEY}:${SECRET}@${CLOUD}?upload_prefix=${fake.url}`;
const listings = await import("@/app/api/listings/route");
const one = await import("@/app/api/listings/[id]/route");
const photos = await import("@/app/api/listings/[id]/photos/route");
const sign = await import("@/app/api/media/sign/route");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let owner = "";
let other = "";
let listingId = "";

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  owner = (await createUser({ roles: ["supplier"] })).id;
  other = (await createUser({ roles: ["supplier"] })).id;
  listingId = (await call(listings.POST as never, await request("/api/listings", { as: owner, body: listingBody() }))).json.listing.id;
});
afterAll(async () => {
  await ctx.close();
  await fake.close();
});

/** Signs through the app, then posts the file to the upload URL exactly as the browser form does. */
async function upload(as: string, data: Buffer, filename: string, tamper?: (fields: Record<string, string>) => void) {
  const signed = (await call(sign.POST as never, await request("/api/media/sign", { method: "POST", as }))).json;
  const fields: Record<string, string> = { api_key: signed.api_key, timestamp: String(signed.timestamp), folder: signed.folder, signature: signed.signature };
  tamper?.(fields);
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append("file", new Blob([new Uint8Array(data)], { type: "image/jpeg" }), filename);
  const res = await fetch(signed.upload_url, { method: "POST", body: form });
  return { status: res.status, body: await res.json() };
}
const asPhoto = (b: any) => ({ public_id: b.public_id, version: b.version, signature: b.signature, width: b.width, height: b.height, format: b.format });
const attach = async (as: string, list: unknown[], id = listingId) =>
  call(photos.POST as never, await request(`/api/listings/${id}/photos`, { as, body: { photos: list } }), { id });

describe("a good photo", () => {
  it("uploads, is verified and attached, and comes back without its GPS position or other metadata", async () => {
    const original = await jpegWithPrivateMetadata(640, 480);
    expect(exifHasGps((await sharp(original).metadata()).exif)).toBe(true);
    const up = await upload(owner, original, "front-garden.jpg");
    expect(up.status).toBe(200);
    expect(up.body.public_id.startsWith(`listings/${owner}/`)).toBe(true);

    const res = await attach(owner, [asPhoto(up.body)]);
    expect(res.status).toBe(201);
    expect(res.json.photos).toHaveLength(1);
    const stored = await ctx.db("listing_photos").where({ listing_id: listingId });
    expect(stored.map((p: any) => [p.public_id, p.width, p.height, p.format])).toEqual([[up.body.public_id, 640, 480, "jpg"]]);

    // The page's URL, built by next-cloudinary's helper, points at the fake and serves a clean image.
    const detail = (await call(one.GET as never, await request(`/api/listings/${listingId}`), { id: listingId })).json.listing;
    const [shown] = detail.photos;
    expect(shown.url.startsWith(`${fake.url}/${CLOUD}/image/upload/`)).toBe(true);
    const delivered = await fetch(shown.url, { headers: { Accept: "image/jpeg" } });
    expect(delivered.status).toBe(200);
    const bytes = Buffer.from(await delivered.arrayBuffer());
    const meta = await sharp(bytes).metadata();
    expect([meta.width, meta.height]).toEqual([shown.width, shown.height]);
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(bytes.includes(Buffer.from("DuffbankTestCam"))).toBe(false);
    const kept = await fake.state.readOriginal(up.body.public_id);
    expect((await sharp(kept!).metadata()).exif).toBeUndefined();

    // Browse cards get the cropped card size.
    const item = (await call(listings.GET as never, await request("/api/listings?limit=100"))).json.items.find((i: any) => i.id === listingId);
    expect(item.photos).toHaveLength(1);
    expect([item.photos[0].width, item.photos[0].height]).toEqual([480, 360]);
    const card = await sharp(Buffer.from(await (await fetch(item.photos[0].url)).arrayBuffer())).metadata();
    expect([card.width, card.height]).toEqual([480, 360]);
  });

  it("can be posted with the listing itself", async () => {
    const a = await upload(owner, await solid(300, 200).jpeg().toBuffer(), "a.jpg");
    const b = await upload(owner, await solid(200, 300).png().toBuffer(), "b.png");
    const res = await call(listings.POST as never, await request("/api/listings", { as: owner, body: listingBody({ photos: [asPhoto(a.body), asPhoto(b.body)] }) }));
    expect(res.status).toBe(201);
    expect(res.json.listing.photos.map((p: any) => p.url)).toHaveLength(2);
    expect(res.json.listing.photo_records.map((p: any) => p.public_id)).toEqual([a.body.public_id, b.body.public_id]);
  });
});

describe("refused uploads, each with a clear error", () => {
  it("a bad request signature is refused by the upload API", async () => {
    const res = await upload(owner, await solid(20, 20).jpeg().toBuffer(), "x.jpg", (f) => (f.signature = "0".repeat(40)));
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/^Invalid Signature/);
  });
  it("a signed request for another folder than the one signed is refused", async () => {
    const res = await upload(owner, await solid(20, 20).jpeg().toBuffer(), "x.jpg", (f) => (f.folder = `listings/${other}`));
    expect(res.status).toBe(401);
  });
  it("an upload result with a forged signature is not attached", async () => {
    const up = await upload(owner, await solid(20, 20).jpeg().toBuffer(), "x.jpg");
    const forged = { ...asPhoto(up.body), signature: "a".repeat(40) };
    const res = await attach(owner, [forged]);
    expect(res.status).toBe(422);
    expect(res.json.error.fields["photos.0"]).toMatch(/could not be verified/);
    const swapped = { ...asPhoto(up.body), version: up.body.version + 1 };
    expect((await attach(owner, [swapped])).status).toBe(422);
  });
  it("someone else's upload is not attached to my listing", async () => {
    const theirs = await upload(other, await solid(20, 20).jpeg().toBuffer(), "x.jpg");
    const res = await attach(owner, [asPhoto(theirs.body)]);
    expect(res.status).toBe(422);
    expect(res.json.error.fields["photos.0"]).toMatch(/not uploaded from your account/);
  });
  it("an SVG is refused by content", async () => {
    const res = await upload(owner, SVG, "leaves.svg");
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/web page or drawing/);
  });
  it("an HTML file renamed .jpg is refused by content, not by its name", async () => {
    const res = await upload(owner, HTML, "leaves.jpg");
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not a photo/);
  });
  it("an oversize file is refused with the limit named", async () => {
    const big = Buffer.concat([await noisy(64, 64).jpeg().toBuffer(), Buffer.alloc(MAX_UPLOAD_BYTES + 1024, 0xff)]);
    const res = await upload(owner, big, "huge.jpg");
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe(`File size too large. Maximum is ${MAX_UPLOAD_BYTES}.`);
  });
});

describe("managing a listing's photos", () => {
  it("keeps at most six, reorders them and removes one (and its image)", async () => {
    const made = (await call(listings.POST as never, await request("/api/listings", { as: owner, body: listingBody({ title: "Six photos" }) }))).json.listing.id;
    const ups = [];
    for (let i = 0; i < 7; i++) ups.push(asPhoto((await upload(owner, await solid(40 + i, 40).jpeg().toBuffer(), `p${i}.jpg`)).body));
    expect((await attach(owner, ups.slice(0, 6), made)).status).toBe(201);
    const seventh = await attach(owner, [ups[6]], made);
    expect(seventh.status).toBe(409);
    expect(seventh.json.error.message).toMatch(/at most 6/);

    const rows = await ctx.db("listing_photos").where({ listing_id: made }).orderBy("position");
    const order = rows.map((r: any) => r.id).reverse();
    const reordered = await call(photos.PATCH as never, await request(`/api/listings/${made}/photos`, { method: "PATCH", as: owner, body: { order } }), { id: made });
    expect(reordered.status).toBe(200);
    expect(reordered.json.photos.map((p: any) => p.id)).toEqual(order);
    const partial = await call(photos.PATCH as never, await request(`/api/listings/${made}/photos`, { method: "PATCH", as: owner, body: { order: order.slice(1) } }), { id: made });
    expect(partial.status).toBe(422);

    const gone = rows[0];
    expect(fake.state.assets.has(gone.public_id)).toBe(true);
    const removed = await call(photos.DELETE as never, await request(`/api/listings/${made}/photos`, { method: "DELETE", as: owner, body: { photo_id: gone.id } }), { id: made });
    expect(removed.status).toBe(200);
    expect(removed.json.photos).toHaveLength(5);
    expect(removed.json.photos.map((p: any) => p.id)).not.toContain(gone.id);
    expect(fake.state.assets.has(gone.public_id)).toBe(false);
    const positions = (await ctx.db("listing_photos").where({ listing_id: made }).orderBy("position")).map((r: any) => r.position);
    expect(positions).toEqual([0, 1, 2, 3, 4]);
    const again = await call(photos.DELETE as never, await request(`/api/listings/${made}/photos`, { method: "DELETE", as: owner, body: { photo_id: gone.id } }), { id: made });
    expect(again.status).toBe(404);
  });
});
