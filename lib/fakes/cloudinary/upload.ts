// The Upload API's upload and destroy methods: verify the signed request, sanitise the
// image (the same lib/media code the app relies on), store it and answer with the fields
// Cloudinary returns, so app code written against this fake works unchanged on the real
// service. Errors use Cloudinary's shape: { "error": { "message": "..." } }.

import crypto from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import { MAX_UPLOAD_BYTES } from "../../media/image-limits";
import { isImageRejectedError } from "../../media/image-rejected-error";
import { sanitizeImage } from "../../media/sanitize-image";
import type { DerivedCache } from "./delivery";
import { FormError, readUploadForm } from "./form";
import { responseSignature, verifySignedRequest, type SignatureAlgorithm } from "./signature";
import type { AssetStore, StoredAsset } from "./store";

export interface UploadContext {
  store: AssetStore;
  cache: DerivedCache;
  cloudName: string;
  apiKey: string;
  apiSecret: string;
  signatureAlgorithm: SignatureAlgorithm;
  now: () => number;
  /** Base of delivery URLs, e.g. http://127.0.0.1:12112 */
  baseUrl: () => string;
}

export function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, {
    "Content-Type": "application/json; charset=utf-8",
    "Content-Length": Buffer.byteLength(text),
    "Access-Control-Allow-Origin": "*",
    ...(status >= 400 && isErrorBody(body) ? { "X-Cld-Error": body.error.message.slice(0, 200).replace(/[^\x20-\x7e]/g, "?") } : {}),
  });
  res.end(text);
}

function isErrorBody(body: unknown): body is { error: { message: string } } {
  return typeof (body as { error?: { message?: unknown } })?.error?.message === "string";
}

export function sendError(res: ServerResponse, status: number, message: string): void {
  sendJson(res, status, { error: { message } });
}

const TOO_LARGE = `File size too large. Maximum is ${MAX_UPLOAD_BYTES}.`;

// Cloudinary refuses these in public IDs; "..", empty segments and control characters are
// refused too so an ID always reads as a clean path.
function validPublicId(id: string): boolean {
  return (
    id.length > 0 &&
    id.length <= 255 &&
    !/[?&#\\%<>\x00-\x1f\x7f]/.test(id) &&
    id.split("/").every((seg) => seg.length > 0 && seg !== "." && seg !== "..")
  );
}

function generatedId(): string {
  // Cloudinary's generated IDs are 20 lowercase letters and digits.
  const alphabet = "abcdefghijklmnopqrstuvwxyz0123456789";
  return Array.from(crypto.randomBytes(20), (b) => alphabet[b % alphabet.length]).join("");
}

function publicIdFrom(fields: Record<string, string>): string {
  const folder = (fields.folder ?? fields.asset_folder ?? "").replace(/^\/+|\/+$/g, "");
  const id = fields.public_id?.replace(/^\/+/, "") || generatedId();
  return folder ? `${folder}/${id}` : id;
}

function deliveryUrl(ctx: UploadContext, asset: Pick<StoredAsset, "version" | "public_id" | "format">): string {
  return `${ctx.baseUrl()}/${ctx.cloudName}/image/upload/v${asset.version}/${asset.public_id}.${asset.format}`;
}

function uploadResponse(ctx: UploadContext, asset: StoredAsset, extra: Record<string, unknown> = {}) {
  const { file: _file, ...rest } = asset;
  const url = deliveryUrl(ctx, asset);
  return {
    ...rest,
    resource_type: "image",
    type: "upload",
    placeholder: false,
    url,
    // The fake speaks plain HTTP only, so the "secure" URL is the same address.
    secure_url: url,
    api_key: ctx.apiKey,
    ...extra,
  };
}

/** Reads the form and checks its signature; answers the error itself and returns null on failure. */
async function readSigned(req: IncomingMessage, res: ServerResponse, ctx: UploadContext) {
  let form;
  try {
    form = await readUploadForm(req, { maxFileBytes: MAX_UPLOAD_BYTES, tooLargeMessage: TOO_LARGE });
  } catch (err) {
    if (err instanceof FormError) {
      sendError(res, err.status, err.message);
      return null;
    }
    throw err;
  }
  const verdict = verifySignedRequest(form.fields, {
    apiKey: ctx.apiKey,
    apiSecret: ctx.apiSecret,
    algorithm: ctx.signatureAlgorithm,
    nowSeconds: Math.floor(ctx.now() / 1000),
  });
  if (!verdict.ok) {
    sendError(res, verdict.status, verdict.message);
    return null;
  }
  return form;
}

export async function handleUpload(req: IncomingMessage, res: ServerResponse, ctx: UploadContext): Promise<void> {
  const form = await readSigned(req, res, ctx);
  if (!form) return;
  const { fields, file } = form;
  if (!file) return sendError(res, 400, "Missing required parameter - file");

  const publicId = publicIdFrom(fields);
  if (!validPublicId(publicId)) return sendError(res, 400, `Invalid public_id ${publicId}`);

  const existing = ctx.store.get(publicId);
  // The SDK sends booleans as "1"/"0" (utils.as_safe_bool); HTML forms send "true"/"false".
  if (existing && (fields.overwrite === "0" || fields.overwrite === "false")) {
    return sendJson(res, 200, uploadResponse(ctx, existing, { existing: true }));
  }

  let image;
  try {
    image = await sanitizeImage(file.data);
  } catch (err) {
    if (isImageRejectedError(err)) return sendError(res, 400, err.message);
    throw err;
  }

  const nowMs = ctx.now();
  const version = Math.floor(nowMs / 1000);
  const asset: StoredAsset = {
    asset_id: crypto.randomBytes(16).toString("hex"),
    public_id: publicId,
    version,
    version_id: crypto.randomBytes(16).toString("hex"),
    signature: responseSignature(publicId, version, ctx.apiSecret),
    width: image.width,
    height: image.height,
    format: image.format,
    bytes: image.bytes,
    etag: crypto.createHash("md5").update(image.data).digest("hex"),
    created_at: new Date(nowMs).toISOString().replace(/\.\d+Z$/, "Z"),
    tags: (fields.tags ?? "").split(",").map((t) => t.trim()).filter(Boolean),
    original_filename: file.filename.replace(/\.[^.]*$/, "") || "file",
    asset_folder: (fields.folder ?? fields.asset_folder ?? "").replace(/^\/+|\/+$/g, ""),
    file: "",
  };
  asset.file = `${asset.asset_id}.${asset.format}`;

  await ctx.store.put(asset, image.data);
  if (existing) ctx.cache.evict(existing.version_id);
  sendJson(res, 200, uploadResponse(ctx, asset));
}

export async function handleDestroy(req: IncomingMessage, res: ServerResponse, ctx: UploadContext): Promise<void> {
  const form = await readSigned(req, res, ctx);
  if (!form) return;
  const publicId = form.fields.public_id;
  if (!publicId) return sendError(res, 400, "Missing required parameter - public_id");
  const removed = await ctx.store.remove(publicId);
  if (removed) ctx.cache.evict(removed.version_id);
  // Cloudinary answers 200 either way and says which in `result`.
  sendJson(res, 200, { result: removed ? "ok" : "not found" });
}
