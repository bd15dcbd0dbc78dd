// Delivery URLs: the URLs next-cloudinary and the SDK build must load from the fake, and
// each supported transformation must produce the size and format it promises.

import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signParams } from "@/lib/fakes/cloudinary/signature";
import { startCloudinaryFake, type CloudinaryFake } from "@/lib/fakes/cloudinary/server";
import { noisy } from "../unit/media/image-fixtures";

const KEY = "duffbank_key";
const SECRET = "duffbank_secret";
const CLOUD = "duffbank-local";

const previousCloudinaryUrl = process.env.CLOUDINARY_URL;
process.env.CLOUDINARY_URL = `cloudinary://${KEY}:${SECRET}@${CLOUD}?upload_prefix=http://127.0.0.1:1`;
const { v2: cloudinary } = await import("cloudinary");
// The SDK has read it by now; restore it so nothing else in this process sees the placeholder.
if (previousCloudinaryUrl === undefined) delete process.env.CLOUDINARY_URL;
else process.env.CLOUDINARY_URL = previousCloudinaryUrl;
const { getCldImageUrl } = await import("next-cloudinary");

const WEBP_ACCEPT = "image/avif,image/webp,image/apng,image/*,*/*;q=0.8"; // what Chromium sends for <img>
const NO_WEBP_ACCEPT = "image/jpeg,image/png,*/*;q=0.5";

let fake: CloudinaryFake;

async function upload(publicId: string, data: Buffer): Promise<void> {
  const params = { timestamp: String(Math.floor(Date.now() / 1000)), public_id: publicId };
  const form = new FormData();
  for (const [k, v] of Object.entries(params)) form.append(k, v);
  form.append("api_key", KEY);
  form.append("signature", signParams(params, SECRET));
  form.append("file", new Blob([new Uint8Array(data)]), "x");
  const res = await fetch(`${fake.url}/v1_1/${CLOUD}/image/upload`, { method: "POST", body: form });
  expect(res.status).toBe(200);
}

async function get(pathOrUrl: string, accept = NO_WEBP_ACCEPT, extra: Record<string, string> = {}) {
  const url = pathOrUrl.startsWith("http") ? pathOrUrl : `${fake.url}/${CLOUD}/image/upload/${pathOrUrl}`;
  const res = await fetch(url, { headers: { Accept: accept, ...extra } });
  const body = Buffer.from(await res.arrayBuffer());
  const meta = res.status === 200 ? await sharp(body).metadata() : undefined;
  return { res, body, meta };
}

beforeAll(async () => {
  fake = await startCloudinaryFake({ port: 0 });
  cloudinary.config({ cloud_name: CLOUD, api_key: KEY, api_secret: SECRET, upload_prefix: fake.url });
  await upload("listings/leaf-bags", await noisy(400, 300).jpeg().toBuffer()); // 4:3 landscape
  await upload(
    "icons/dot",
    await sharp({ create: { width: 40, height: 40, channels: 4, background: { r: 200, g: 0, b: 0, alpha: 0.5 } } })
      .png()
      .toBuffer(),
  );
});

afterAll(async () => {
  await fake?.close();
});

describe("URLs built by next-cloudinary and the SDK", () => {
  const cldConfig = () => ({
    cloud: { cloudName: CLOUD },
    url: { secure: false, cname: new URL(fake.url).host, analytics: false },
  });

  it("serves getCldImageUrl(width, height, crop fill, format auto, quality auto)", async () => {
    const url = getCldImageUrl(
      { src: "listings/leaf-bags", width: 200, height: 100, crop: "fill", format: "auto", quality: "auto" },
      cldConfig(),
    );
    // The exact shape next-cloudinary 6.19.3 produces; if it changes, the fake's parser must follow.
    expect(url).toBe(`${fake.url}/${CLOUD}/image/upload/c_fill,w_200,h_100,g_auto/f_auto/q_auto/v1/listings/leaf-bags`);

    const webp = await get(url, WEBP_ACCEPT);
    expect(webp.res.status).toBe(200);
    expect(webp.res.headers.get("content-type")).toBe("image/webp");
    expect([webp.meta?.format, webp.meta?.width, webp.meta?.height]).toEqual(["webp", 200, 100]);

    const jpeg = await get(url, NO_WEBP_ACCEPT);
    expect([jpeg.meta?.format, jpeg.meta?.width, jpeg.meta?.height]).toEqual(["jpeg", 200, 100]);
  });

  it("serves getCldImageUrl with analytics left on (the ?_a= query is ignored)", async () => {
    const url = getCldImageUrl(
      { src: "listings/leaf-bags", width: 120 },
      { cloud: { cloudName: CLOUD }, url: { secure: false, cname: new URL(fake.url).host } },
    );
    expect(url).toContain("?_a=");
    const { res, meta } = await get(url);
    expect(res.status).toBe(200);
    expect(meta?.width).toBe(120);
  });

  it("serves cloudinary.url with the same options", async () => {
    const url = cloudinary.url("listings/leaf-bags", {
      secure: false,
      cname: new URL(fake.url).host,
      width: 200,
      height: 100,
      crop: "fill",
      gravity: "auto",
      fetch_format: "auto",
      quality: "auto",
    });
    expect(url.startsWith(`${fake.url}/${CLOUD}/image/upload/c_fill,f_auto,g_auto,h_100,q_auto,w_200/v1/listings/leaf-bags`)).toBe(true);
    const { res, meta } = await get(url, WEBP_ACCEPT);
    expect(res.status).toBe(200);
    expect([meta?.format, meta?.width, meta?.height]).toEqual(["webp", 200, 100]);
  });
});

describe("transformations (source is 400 × 300)", () => {
  it.each([
    ["w_200,h_100,c_fill", 200, 100],
    ["c_fill,g_center,w_50,h_150", 50, 150],
    ["w_100", 100, 75],
    ["h_150", 200, 150],
    ["c_scale,w_100,h_100", 100, 100],
    ["c_fill,w_100", 100, 75],
    ["c_fit,h_600", 800, 600],
    ["c_fit,w_800,h_800", 800, 600],
    ["c_limit,w_200", 200, 150],
    ["c_limit,w_1000,h_1000", 400, 300],
    ["c_lfill,w_1000,h_50", 400, 50],
    ["c_fill,w_300,h_300/c_scale,w_150", 150, 150],
    ["dpr_2.0,w_100", 200, 150],
    ["c_fill,w_99999,h_10", 4096, 10],
  ])("%s → %i × %i", async (t, width, height) => {
    const { res, meta } = await get(`${t}/v1/listings/leaf-bags.jpg`);
    expect(res.status).toBe(200);
    expect([meta?.width, meta?.height]).toEqual([width, height]);
  });

  it("serves the original size with no transformation and no version", async () => {
    const { meta } = await get("listings/leaf-bags.jpg");
    expect([meta?.width, meta?.height]).toEqual([400, 300]);
  });

  it("lets the extension choose the format, and an f_ component override it", async () => {
    expect((await get("w_50/v1/listings/leaf-bags.png")).meta?.format).toBe("png");
    expect((await get("w_50,f_webp/v1/listings/leaf-bags.jpg")).meta?.format).toBe("webp");
    expect((await get("w_50/v1/listings/leaf-bags")).meta?.format).toBe("jpeg");
  });

  it("f_auto sends WebP only when Accept lists it, and says it varies by Accept", async () => {
    const webp = await get("f_auto,w_60/v3/listings/leaf-bags", WEBP_ACCEPT);
    expect(webp.res.headers.get("content-type")).toBe("image/webp");
    expect(webp.res.headers.get("vary")).toBe("Accept");
    expect((await get("f_auto,w_60/v3/listings/leaf-bags", NO_WEBP_ACCEPT)).meta?.format).toBe("jpeg");
    expect((await get("f_auto,w_60/v3/listings/leaf-bags", "image/webp;q=0, */*")).meta?.format).toBe("jpeg");
  });

  it("f_auto keeps transparency as PNG for a browser without WebP", async () => {
    const { meta } = await get("f_auto/v1/icons/dot", NO_WEBP_ACCEPT);
    expect(meta?.format).toBe("png");
    expect(meta?.hasAlpha).toBe(true);
  });

  it("q_ changes the encode: q_10 is smaller than q_auto", async () => {
    const low = await get("w_300,q_10/v1/listings/leaf-bags.jpg");
    const auto = await get("w_300,q_auto/v1/listings/leaf-bags.jpg");
    expect(low.body.length).toBeLessThan(auto.body.length);
  });

  it.each([
    ["e_sepia", /Invalid transformation component - e_sepia/],
    ["c_pad,w_100", /Unsupported crop mode c_pad/],
    ["w_abc", /Invalid width value abc/],
    ["w_0", /Invalid width/],
    ["q_101", /Invalid quality/],
    ["g_face", /Unsupported gravity/],
    ["f_gif", /Unsupported format f_gif/],
  ])("refuses %s with 400 and an X-Cld-Error header", async (t, message) => {
    const { res } = await get(`${t}/v1/listings/leaf-bags.jpg`);
    expect(res.status).toBe(400);
    expect(res.headers.get("x-cld-error")).toMatch(message);
  });

  it("refuses an unsupported extension on a known asset", async () => {
    expect((await get("v1/listings/leaf-bags.gif")).res.status).toBe(400);
  });

  it("answers 404 for an unknown public_id, in any form", async () => {
    for (const p of ["v1/listings/nope.jpg", "w_100/v1/listings/nope", "nope"]) {
      const { res } = await get(p);
      expect(res.status).toBe(404);
      expect(res.headers.get("x-cld-error")).toMatch(/Resource not found/);
    }
  });
});

describe("delivery headers and caching", () => {
  it("sends type, long cache lifetime, nosniff and an ETag honoured by If-None-Match", async () => {
    const first = await get("w_77/v1/listings/leaf-bags.jpg");
    expect(first.res.headers.get("content-type")).toBe("image/jpeg");
    expect(first.res.headers.get("cache-control")).toBe("public, max-age=2592000");
    expect(first.res.headers.get("x-content-type-options")).toBe("nosniff");
    const etag = first.res.headers.get("etag")!;
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/);
    const again = await fetch(`${fake.url}/${CLOUD}/image/upload/w_77/v1/listings/leaf-bags.jpg`, {
      headers: { "If-None-Match": etag },
    });
    expect(again.status).toBe(304);
  });

  it("renders a derived image once and serves repeats from the cache", async () => {
    const before = fake.state.derivedCacheSize();
    const a = await get("w_91/v1/listings/leaf-bags.jpg");
    const b = await get("w_91/v1/listings/leaf-bags.jpg");
    expect(fake.state.derivedCacheSize()).toBe(before + 1);
    expect(a.body.equals(b.body)).toBe(true);
  });

  it("answers HEAD with headers and no body", async () => {
    const res = await fetch(`${fake.url}/${CLOUD}/image/upload/w_40/v1/listings/leaf-bags.jpg`, { method: "HEAD" });
    expect(res.status).toBe(200);
    expect(Number(res.headers.get("content-length"))).toBeGreaterThan(0);
    expect((await res.arrayBuffer()).byteLength).toBe(0);
  });
});

describe("persistence", () => {
  it("serves an upload again after a restart on the same data directory", async () => {
    const dir = await fs.mkdtemp(path.join(os.tmpdir(), "fake-cloudinary-persist-"));
    try {
      const first = await startCloudinaryFake({ port: 0, dataDir: dir });
      const result = await cloudinary.uploader.upload(
        `data:image/jpeg;base64,${(await noisy(30, 20).jpeg().toBuffer()).toString("base64")}`,
        { public_id: "kept", upload_prefix: first.url },
      );
      await first.close();
      const second = await startCloudinaryFake({ port: 0, dataDir: dir });
      try {
        const res = await fetch(`${second.url}/${CLOUD}/image/upload/v${result.version}/kept.jpg`);
        expect(res.status).toBe(200);
        expect((await sharp(Buffer.from(await res.arrayBuffer())).metadata()).width).toBe(30);
      } finally {
        await second.close();
      }
      // A caller-supplied directory is left in place on close.
      expect((await fs.readdir(dir)).includes("index.json")).toBe(true);
    } finally {
      await fs.rm(dir, { recursive: true, force: true });
    }
  });
});
