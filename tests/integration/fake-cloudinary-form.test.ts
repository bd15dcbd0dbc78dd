// The fake's Upload API driven the way a browser (FormData, via fetch or XHR) or a
// hand-written client calls it: CORS, every signature failure, content refusals, limits.

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_UPLOAD_BYTES } from "@/lib/media/image-limits";
import { signParams } from "@/lib/fakes/cloudinary/signature";
import { startCloudinaryFake, type CloudinaryFake } from "@/lib/fakes/cloudinary/server";
import { HTML, HTML_PAYLOAD, pngClaimingSize, solid, SVG } from "../unit/media/image-fixtures";

const KEY = "test_key";
const SECRET = "test_secret";
const CLOUD = "duffbank-local";

let fake: CloudinaryFake;

beforeAll(async () => {
  fake = await startCloudinaryFake({ port: 0, apiKey: KEY, apiSecret: SECRET, cloudName: CLOUD });
});

afterAll(async () => {
  await fake?.close();
});

const dataUri = (buf: Buffer, mime = "image/jpeg") => `data:${mime};base64,${buf.toString("base64")}`;
const nowSeconds = () => Math.floor(Date.now() / 1000);

/** Posts multipart the way a browser's FormData does; `secret` decides the signature. */
async function postForm(
  action: "upload" | "destroy",
  params: Record<string, string>,
  file?: { data: Buffer; filename: string; type?: string },
  secret = SECRET,
): Promise<{ status: number; body: any }> {
  const form = new FormData();
  const signed = { timestamp: String(nowSeconds()), ...params };
  for (const [k, v] of Object.entries(signed)) form.append(k, v);
  form.append("api_key", KEY);
  form.append("signature", signParams(signed, secret));
  if (file) form.append("file", new Blob([new Uint8Array(file.data)], { type: file.type ?? "image/jpeg" }), file.filename);
  const res = await fetch(`${fake.url}/v1_1/${CLOUD}/image/${action}`, { method: "POST", body: form });
  return { status: res.status, body: await res.json() };
}

describe("upload as a browser sends it (multipart FormData)", () => {
  it("accepts a correctly signed upload and answers the CORS preflight", async () => {
    const pre = await fetch(`${fake.url}/v1_1/${CLOUD}/image/upload`, {
      method: "OPTIONS",
      headers: { Origin: "http://localhost:3000", "Access-Control-Request-Method": "POST" },
    });
    expect(pre.status).toBe(204);
    expect(pre.headers.get("access-control-allow-origin")).toBe("*");

    const { status, body } = await postForm("upload", { folder: "listings" }, {
      data: await solid(30, 30).webp().toBuffer(),
      filename: "worms.webp",
      type: "image/webp",
    });
    expect(status).toBe(200);
    expect(body).toMatchObject({ format: "webp", width: 30, original_filename: "worms" });
  });

  it("refuses a request signed with the wrong secret", async () => {
    const res = await postForm("upload", { folder: "x" }, { data: await solid(8, 8).jpeg().toBuffer(), filename: "a.jpg" }, "wrong-secret");
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/^Invalid Signature [0-9a-f]{40}\. String to sign - 'folder=x&timestamp=\d+'\.$/);
  });

  it("refuses a signature that does not cover a tampered parameter", async () => {
    const ts = String(nowSeconds());
    const form = new FormData();
    form.append("timestamp", ts);
    form.append("folder", "someone-elses-folder"); // not what was signed
    form.append("api_key", KEY);
    form.append("signature", signParams({ timestamp: ts, folder: "listings" }, SECRET));
    form.append("file", new Blob([new Uint8Array(await solid(8, 8).jpeg().toBuffer())]), "a.jpg");
    const res = await fetch(`${fake.url}/v1_1/${CLOUD}/image/upload`, { method: "POST", body: form });
    expect(res.status).toBe(401);
    expect((await res.json()).error.message).toContain("folder=someone-elses-folder&timestamp=");
  });

  it.each([
    ["no signature", { signature: "" }, 401, /^Invalid Signature \(none given\)/],
    ["no api_key", { api_key: "" }, 401, /^Must supply api_key$/],
    ["another api_key", { api_key: "other" }, 401, /^Unknown API key other$/],
    ["no timestamp", { timestamp: "" }, 400, /^Missing required parameter - timestamp$/],
  ])("refuses a request with %s", async (_n, override, status, message) => {
    const ts = String(nowSeconds());
    const fields: Record<string, string> = { timestamp: ts, api_key: KEY, signature: signParams({ timestamp: ts }, SECRET), ...override };
    const form = new FormData();
    for (const [k, v] of Object.entries(fields)) if (v) form.append(k, v);
    form.append("file", new Blob([new Uint8Array(await solid(8, 8).jpeg().toBuffer())]), "a.jpg");
    const res = await fetch(`${fake.url}/v1_1/${CLOUD}/image/upload`, { method: "POST", body: form });
    expect(res.status).toBe(status);
    expect((await res.json()).error.message).toMatch(message);
  });

  it("refuses a signed request with no file", async () => {
    const res = await postForm("upload", { folder: "listings" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe("Missing required parameter - file");
  });

  it("treats resource type auto (what browsers often post to) as image", async () => {
    const signed = { timestamp: String(nowSeconds()) };
    const form = new FormData();
    form.append("timestamp", signed.timestamp);
    form.append("api_key", KEY);
    form.append("signature", signParams(signed, SECRET));
    form.append("file", new Blob([new Uint8Array(await solid(9, 9).png().toBuffer())]), "a.png");
    const res = await fetch(`${fake.url}/v1_1/${CLOUD}/auto/upload`, { method: "POST", body: form });
    expect(res.status).toBe(200);
    expect((await res.json()).resource_type).toBe("image");
  });

  it("accepts urlencoded bodies with the file as a data URI", async () => {
    const signed = { timestamp: String(nowSeconds()), public_id: "urlencoded-1" };
    const body = new URLSearchParams({
      ...signed,
      api_key: KEY,
      signature: signParams(signed, SECRET),
      file: dataUri(await solid(12, 12).jpeg().toBuffer()),
    });
    const res = await fetch(`${fake.url}/v1_1/${CLOUD}/image/upload`, { method: "POST", body });
    expect(res.status).toBe(200);
    expect((await res.json()).public_id).toBe("urlencoded-1");
  });

  const refusals: Array<[string, () => Promise<Buffer>, RegExp]> = [
    ["an SVG", async () => SVG, /SVG/],
    ["HTML named photo.jpg", async () => HTML, /not a photo/],
    ["a JPEG with HTML appended (polyglot)", async () => Buffer.concat([await solid(16, 16).jpeg().toBuffer(), HTML_PAYLOAD]), /script/],
    ["a GIF", () => solid(16, 16).gif().toBuffer(), /GIF/],
    ["a 50000 × 50000 PNG bomb", async () => pngClaimingSize(await solid(4, 4).png().toBuffer(), 50_000, 50_000), /50000 × 50000/],
  ];

  it.each(refusals)("refuses %s with 400 and stores nothing", async (_n, make, message) => {
    const before = fake.state.assets.size;
    const res = await postForm("upload", {}, { data: await make(), filename: "photo.jpg" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
    expect(fake.state.assets.size).toBe(before);
  });

  it("refuses a file over 10 MB without storing it", async () => {
    const jpeg = await solid(16, 16).jpeg().toBuffer();
    const big = Buffer.concat([jpeg, Buffer.alloc(MAX_UPLOAD_BYTES + 1 - jpeg.length)]);
    const res = await postForm("upload", {}, { data: big, filename: "big.jpg" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe(`File size too large. Maximum is ${MAX_UPLOAD_BYTES}.`);
  });

  it("refuses a public_id that tries to climb out of its folder", async () => {
    const res = await postForm("upload", { public_id: "../../etc/passwd" }, { data: await solid(8, 8).jpeg().toBuffer(), filename: "a.jpg" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Invalid public_id/);
  });

  it("requires a signature for destroy too", async () => {
    await postForm("upload", { public_id: "keep-me" }, { data: await solid(8, 8).jpeg().toBuffer(), filename: "a.jpg" });
    const res = await postForm("destroy", { public_id: "keep-me" }, undefined, "wrong-secret");
    expect(res.status).toBe(401);
    expect(fake.state.assets.has("keep-me")).toBe(true);
  });

  it("answers an unknown cloud name with 401", async () => {
    const res = await fetch(`${fake.url}/v1_1/someone-else/image/upload`, { method: "POST", body: new FormData() });
    expect(res.status).toBe(401);
    expect((await res.json()).error.message).toBe("Invalid cloud_name someone-else");
  });
});
