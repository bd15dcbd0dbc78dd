// The fake's Upload API driven by the official cloudinary SDK: what is stored and served,
// the response fields, overwrite and destroy, and the refusals the SDK surfaces.

import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_UPLOAD_BYTES } from "@/lib/media/image-limits";
import { startCloudinaryFake, type CloudinaryFake } from "@/lib/fakes/cloudinary/server";
import { exifHasGps, HTML, jpegWithPrivateMetadata, solid, SVG } from "../unit/media/image-fixtures";

const KEY = "test_key";
const SECRET = "test_secret";
const CLOUD = "duffbank-local";

// The SDK picks the http or https module once, when it is first loaded, from the
// upload_prefix in CLOUDINARY_URL (cloudinary 2.11.0 lib/uploader.js). The fake's port is
// not known yet, so an http:// prefix is set before import and the real one is passed
// later through config; only the scheme matters at load time.
const previousCloudinaryUrl = process.env.CLOUDINARY_URL;
process.env.CLOUDINARY_URL = `cloudinary://${KEY}:${SECRET}@${CLOUD}?upload_prefix=http://127.0.0.1:1`;
const { v2: cloudinary } = await import("cloudinary");
// The SDK has read it by now; restore it so nothing else in this process sees the placeholder.
if (previousCloudinaryUrl === undefined) delete process.env.CLOUDINARY_URL;
else process.env.CLOUDINARY_URL = previousCloudinaryUrl;

let fake: CloudinaryFake;
let tmp: string;

beforeAll(async () => {
  fake = await startCloudinaryFake({ port: 0, apiKey: KEY, apiSecret: SECRET, cloudName: CLOUD });
  cloudinary.config({ cloud_name: CLOUD, api_key: KEY, api_secret: SECRET, upload_prefix: fake.url });
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), "fake-cloudinary-test-"));
});

afterAll(async () => {
  await fake?.close();
  if (tmp) await fs.rm(tmp, { recursive: true, force: true });
});

const dataUri = (buf: Buffer, mime = "image/jpeg") => `data:${mime};base64,${buf.toString("base64")}`;
const nowSeconds = () => Math.floor(Date.now() / 1000);

async function sdkRejection(file: string, options: Record<string, unknown> = {}) {
  try {
    await cloudinary.uploader.upload(file, options);
  } catch (err) {
    return err as { message: string; http_code: number };
  }
  throw new Error("expected the upload to be refused");
}

describe("upload through the official SDK", () => {
  it("stores and serves a JPEG with its GPS, EXIF, XMP and ICC removed", async () => {
    const input = await jpegWithPrivateMetadata(120, 80);
    expect(exifHasGps((await sharp(input).metadata()).exif)).toBe(true);

    const result = await cloudinary.uploader.upload(dataUri(input), { folder: "listings", tags: ["leaves", "demo"] });

    expect(result).toMatchObject({
      resource_type: "image",
      type: "upload",
      format: "jpg",
      width: 120,
      height: 80,
      tags: ["leaves", "demo"],
      placeholder: false,
      original_filename: "file",
    });
    expect(result.public_id).toMatch(/^listings\/[a-z0-9]{20}$/);
    expect(result.asset_id).toMatch(/^[0-9a-f]{32}$/);
    expect(Number.isInteger(result.version)).toBe(true);
    expect(new Date(result.created_at).toISOString()).toBe(result.created_at.replace("Z", ".000Z"));
    expect(result.secure_url).toBe(`${fake.url}/${CLOUD}/image/upload/v${result.version}/${result.public_id}.jpg`);
    // Present in the SDK's JavaScript but missing from its type definitions.
    const { verify_api_response_signature } = cloudinary.utils as unknown as {
      verify_api_response_signature(publicId: string, version: number, signature: string): boolean;
    };
    expect(verify_api_response_signature(result.public_id, result.version, result.signature)).toBe(true);

    const stored = await fake.state.readOriginal(result.public_id);
    expect(stored?.length).toBe(result.bytes);
    const storedMeta = await sharp(stored!).metadata();
    expect(storedMeta.exif).toBeUndefined();
    expect(storedMeta.xmp).toBeUndefined();
    expect(storedMeta.icc).toBeUndefined();

    const res = await fetch(result.secure_url);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/jpeg");
    const delivered = Buffer.from(await res.arrayBuffer());
    const deliveredMeta = await sharp(delivered).metadata();
    expect([deliveredMeta.width, deliveredMeta.height]).toEqual([120, 80]);
    expect(deliveredMeta.exif).toBeUndefined();
    expect(delivered.includes(Buffer.from("DuffbankTestCam"))).toBe(false);
  });

  it("uploads a file from disk as a file part, honouring public_id, folder and the file name", async () => {
    const file = path.join(tmp, "straw-bales.png");
    await fs.writeFile(file, await solid(50, 30).png().toBuffer());
    const result = await cloudinary.uploader.upload(file, { folder: "listings/farm", public_id: "bales-1" });
    expect(result.public_id).toBe("listings/farm/bales-1");
    expect(result.format).toBe("png");
    expect(result.original_filename).toBe("straw-bales");
    expect(fake.state.assets.get("listings/farm/bales-1")?.asset_folder).toBe("listings/farm");
  });

  it("replaces an asset on re-upload, and keeps it when overwrite is false", async () => {
    const first = await cloudinary.uploader.upload(dataUri(await solid(40, 40).jpeg().toBuffer()), { public_id: "replace-me" });
    const second = await cloudinary.uploader.upload(dataUri(await solid(60, 20).jpeg().toBuffer()), { public_id: "replace-me" });
    expect(second.asset_id).not.toBe(first.asset_id);
    expect([second.width, second.height]).toEqual([60, 20]);
    const kept = await cloudinary.uploader.upload(dataUri(await solid(10, 10).jpeg().toBuffer()), {
      public_id: "replace-me",
      overwrite: false,
    });
    expect(kept.existing).toBe(true);
    expect(kept.asset_id).toBe(second.asset_id);
    expect((await sharp((await fake.state.readOriginal("replace-me"))!).metadata()).width).toBe(60);
  });

  it("destroys an asset: ok, then not found, and delivery then 404s", async () => {
    const up = await cloudinary.uploader.upload(dataUri(await solid(20, 20).jpeg().toBuffer()), { public_id: "to-delete" });
    expect((await fetch(up.secure_url)).status).toBe(200);
    expect(await cloudinary.uploader.destroy("to-delete")).toEqual({ result: "ok" });
    expect(await cloudinary.uploader.destroy("to-delete")).toEqual({ result: "not found" });
    expect((await fetch(up.secure_url)).status).toBe(404);
    expect(fake.state.assets.has("to-delete")).toBe(false);
  });

  it("refuses an SDK configured with the wrong secret (401, Cloudinary's message)", async () => {
    const err = await sdkRejection(dataUri(await solid(8, 8).jpeg().toBuffer()), { api_secret: "not-the-secret" });
    expect(err.http_code).toBe(401);
    expect(err.message).toMatch(/^Invalid Signature [0-9a-f]{40}\. String to sign - 'timestamp=\d+'\.$/);
  });

  it("refuses a request signed more than an hour ago as stale", async () => {
    const err = await sdkRejection(dataUri(await solid(8, 8).jpeg().toBuffer()), { timestamp: nowSeconds() - 3601 });
    expect(err.http_code).toBe(400);
    expect(err.message).toMatch(/^Stale request - reported time is .* which is more than 1 hour ago$/);
  });

  it("refuses an HTML page named photo.jpg, whatever its name says", async () => {
    const file = path.join(tmp, "photo.jpg");
    await fs.writeFile(file, HTML);
    const err = await sdkRejection(file);
    expect(err.http_code).toBe(400);
    expect(err.message).toMatch(/not a photo/);
  });

  it("refuses an SVG sent as a data URI", async () => {
    const err = await sdkRejection(dataUri(SVG, "image/svg+xml"));
    expect(err.http_code).toBe(400);
    expect(err.message).toMatch(/SVG/);
  });

  it("refuses an oversize data URI sent by the SDK", async () => {
    const jpeg = await solid(16, 16).jpeg().toBuffer();
    const big = Buffer.concat([jpeg, Buffer.alloc(MAX_UPLOAD_BYTES + 1 - jpeg.length)]);
    const err = await sdkRejection(dataUri(big));
    expect(err.http_code).toBe(400);
    expect(err.message).toMatch(/File size too large/);
  });

  it("does not fetch remote URLs", async () => {
    const err = await sdkRejection("http://127.0.0.1:9/anything.jpg");
    expect(err.http_code).toBe(400);
    expect(err.message).toMatch(/Remote file URLs are not fetched/);
  });
});

describe("the fake's clock", () => {
  it("uses the injected now() for staleness and versions", async () => {
    const later = Date.now() + 2 * 60 * 60 * 1000;
    const skewed = await startCloudinaryFake({ port: 0, apiKey: KEY, apiSecret: SECRET, now: () => later });
    try {
      // A request signed "now" is two hours old to a fake whose clock runs ahead.
      const err = await sdkRejection(dataUri(await solid(8, 8).jpeg().toBuffer()), { upload_prefix: skewed.url });
      expect(err.message).toMatch(/^Stale request/);
      const ok = await cloudinary.uploader.upload(dataUri(await solid(8, 8).jpeg().toBuffer()), {
        upload_prefix: skewed.url,
        timestamp: Math.floor(later / 1000),
      });
      expect(ok.version).toBe(Math.floor(later / 1000));
    } finally {
      await skewed.close();
    }
  });
});
