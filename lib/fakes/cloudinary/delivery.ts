// Delivery URLs: /<cloud>/image/upload/[<transformation>/...][v<version>/]<public_id>[.<ext>]
// This is the shape both next-cloudinary's getCldImageUrl and the SDK's cloudinary.url
// produce (checked against next-cloudinary 6.19.3 and cloudinary 2.11.0): they always add
// a version segment (v1 when unknown) once the public_id has a folder, may omit the
// extension, and append an analytics query (?_a=...) that is ignored here.

import crypto from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import type { AssetStore, StoredAsset } from "./store";
import { acceptsWebp, CONTENT_TYPES, renderDerived, requestedFormat, type FormatChoice } from "./render";
import {
  deliveryFormat,
  looksLikeTransformation,
  parseTransformations,
  TransformationError,
  type DeliveryFormat,
  type TransformStep,
} from "./transformations";

// Cloudinary's default Cache-Control for delivered assets is 30 days (from memory).
const CACHE_CONTROL = "public, max-age=2592000";
// Product choice: enough for a demo's worth of thumbnails without growing unbounded.
const DERIVED_CACHE_BYTES = 64 * 1024 * 1024;

interface Derived {
  data: Buffer;
  contentType: string;
  etag: string;
}

/** Least-recently-used cache of rendered images, bounded by total bytes. */
export class DerivedCache {
  private readonly entries = new Map<string, Derived>();
  private readonly inflight = new Map<string, Promise<Derived>>();
  private bytes = 0;

  constructor(private readonly maxBytes = DERIVED_CACHE_BYTES) {}

  get size(): number {
    return this.entries.size;
  }

  async getOrRender(key: string, render: () => Promise<Derived>): Promise<Derived> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    // Concurrent requests for the same new size share one render.
    let pending = this.inflight.get(key);
    if (!pending) {
      pending = render().finally(() => this.inflight.delete(key));
      this.inflight.set(key, pending);
      pending.then((d) => this.put(key, d), () => {});
    }
    return pending;
  }

  /** Drops every rendition of an asset version (after destroy or overwrite). */
  evict(versionId: string): void {
    for (const [key, d] of this.entries) {
      if (key.startsWith(`${versionId}|`)) {
        this.entries.delete(key);
        this.bytes -= d.data.length;
      }
    }
  }

  private put(key: string, d: Derived): void {
    if (d.data.length > this.maxBytes || this.entries.has(key)) return;
    this.entries.set(key, d);
    this.bytes += d.data.length;
    for (const [oldKey, old] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(oldKey);
      this.bytes -= old.data.length;
    }
  }
}

export interface ParsedDeliveryPath {
  transformations: string[];
  publicPath: string;
}

export function parseDeliveryPath(segments: string[]): ParsedDeliveryPath {
  let i = 0;
  const transformations: string[] = [];
  while (i < segments.length - 1 && looksLikeTransformation(segments[i])) transformations.push(segments[i++]);
  if (i < segments.length - 1 && /^v\d+$/.test(segments[i])) i++;
  return { transformations, publicPath: segments.slice(i).join("/") };
}

/** The public_id may itself contain dots, so the stored assets decide what the extension is. */
function findAsset(
  store: AssetStore,
  publicPath: string,
): { asset: StoredAsset; extension?: DeliveryFormat } | { error: number; message: string } {
  const dot = publicPath.lastIndexOf(".");
  if (dot > publicPath.lastIndexOf("/")) {
    const asset = store.get(publicPath.slice(0, dot));
    if (asset) {
      const ext = publicPath.slice(dot + 1);
      const extension = deliveryFormat(ext);
      if (!extension) return { error: 400, message: `Unsupported delivery format ${ext}` };
      return { asset, extension };
    }
  }
  const asset = store.get(publicPath);
  if (asset) return { asset };
  return { error: 404, message: `Resource not found - ${publicPath}` };
}

function sendError(res: ServerResponse, status: number, message: string): void {
  // Cloudinary reports delivery errors in this header with an empty-ish body.
  res.writeHead(status, {
    "Content-Type": "text/plain; charset=utf-8",
    "X-Cld-Error": message.replace(/[^\x20-\x7e]/g, "?"),
    "Access-Control-Allow-Origin": "*",
  });
  res.end(message);
}

export interface DeliveryContext {
  store: AssetStore;
  cache: DerivedCache;
}

export async function handleDelivery(
  req: IncomingMessage,
  res: ServerResponse,
  segments: string[],
  ctx: DeliveryContext,
): Promise<void> {
  const { transformations, publicPath } = parseDeliveryPath(segments);
  let steps: TransformStep[];
  try {
    steps = parseTransformations(transformations);
  } catch (err) {
    if (err instanceof TransformationError) return sendError(res, 400, err.message);
    throw err;
  }

  const found = findAsset(ctx.store, publicPath);
  if ("error" in found) return sendError(res, found.error, found.message);
  const { asset, extension } = found;

  const choice: FormatChoice = requestedFormat(steps, extension, asset.format);
  const accept = req.headers.accept;
  const key = [
    asset.version_id,
    transformations.join("/"),
    choice.requested,
    choice.variesByAccept ? (acceptsWebp(accept) ? "webp" : "no-webp") : "",
  ].join("|");

  const derived = await ctx.cache.getOrRender(key, async () => {
    const source = await ctx.store.read(asset);
    const { data, format } = await renderDerived(source, steps, choice, accept);
    const etag = `"${crypto.createHash("md5").update(data).digest("hex")}"`;
    return { data, contentType: CONTENT_TYPES[format], etag };
  });

  const headers: Record<string, string | number> = {
    "Content-Type": derived.contentType,
    "Cache-Control": CACHE_CONTROL,
    ETag: derived.etag,
    "Last-Modified": new Date(asset.created_at).toUTCString(),
    // The bytes are always a fresh sharp encode, and nosniff stops a browser from ever
    // treating them as anything but the declared image type.
    "X-Content-Type-Options": "nosniff",
    "Access-Control-Allow-Origin": "*",
  };
  if (choice.variesByAccept) headers.Vary = "Accept";

  if (req.headers["if-none-match"] === derived.etag) {
    res.writeHead(304, headers);
    res.end();
    return;
  }
  headers["Content-Length"] = derived.data.length;
  res.writeHead(200, headers);
  res.end(req.method === "HEAD" ? undefined : derived.data);
}
