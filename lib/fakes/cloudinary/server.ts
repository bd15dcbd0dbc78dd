// A local stand-in for Cloudinary: the signed Upload API (upload, destroy) and image
// delivery with the transformations Duffbank uses, rendered by sharp. Point the SDK at it
// with upload_prefix and next-cloudinary with a cname (see cli.ts). Tests start their own
// instance on a free port with startCloudinaryFake({ port: 0 }).

import fs from "node:fs/promises";
import http from "node:http";
import type { AddressInfo } from "node:net";
import os from "node:os";
import path from "node:path";
import { DerivedCache, handleDelivery } from "./delivery";
import type { SignatureAlgorithm } from "./signature";
import { AssetStore, type StoredAsset } from "./store";
import { handleDestroy, handleUpload, sendError, sendJson, type UploadContext } from "./upload";
import { listenOn } from "../listen";

export interface CloudinaryFakeOptions {
  /** 0 picks a free port. */
  port?: number;
  host?: string;
  cloudName?: string;
  apiKey?: string;
  apiSecret?: string;
  signatureAlgorithm?: SignatureAlgorithm;
  /** Where stored originals live; a fresh temporary directory (removed on close) if unset. */
  dataDir?: string;
  /** Clock in milliseconds, for signature age, versions and created_at. */
  now?: () => number;
}

export interface CloudinaryFakeState {
  cloudName: string;
  apiKey: string;
  dataDir: string;
  assets: ReadonlyMap<string, StoredAsset>;
  /** The stored (sanitised) bytes of an asset, as uploaded before any transformation. */
  readOriginal(publicId: string): Promise<Buffer | undefined>;
  derivedCacheSize(): number;
}

export interface CloudinaryFake {
  port: number;
  url: string;
  close(): Promise<void>;
  state: CloudinaryFakeState;
}

export const DEFAULT_CLOUD_NAME = "duffbank-local";
export const DEFAULT_API_KEY = "duffbank_key";
export const DEFAULT_API_SECRET = "duffbank_secret";

const CORS_HEADERS = {
  "Access-Control-Allow-Origin": "*",
  "Access-Control-Allow-Methods": "GET, HEAD, POST, OPTIONS",
  // Listening to upload progress in a browser makes the POST non-simple, so it is
  // preflighted; these are the headers browsers and Cloudinary's chunked uploads send.
  "Access-Control-Allow-Headers": "Content-Type, X-Requested-With, X-Unique-Upload-Id, Content-Range",
  "Access-Control-Max-Age": "600",
};

export async function startCloudinaryFake(opts: CloudinaryFakeOptions = {}): Promise<CloudinaryFake> {
  const host = opts.host ?? "127.0.0.1";
  const cloudName = opts.cloudName ?? DEFAULT_CLOUD_NAME;
  const ownsDir = !opts.dataDir;
  const dataDir = opts.dataDir ?? (await fs.mkdtemp(path.join(os.tmpdir(), "cloudinary-fake-")));
  const store = await AssetStore.open(dataDir);
  const cache = new DerivedCache();
  let baseUrl = "";

  const ctx: UploadContext = {
    store,
    cache,
    cloudName,
    apiKey: opts.apiKey ?? DEFAULT_API_KEY,
    apiSecret: opts.apiSecret ?? DEFAULT_API_SECRET,
    signatureAlgorithm: opts.signatureAlgorithm ?? "sha1",
    now: opts.now ?? Date.now,
    baseUrl: () => baseUrl,
  };

  const server = http.createServer((req, res) => {
    route(req, res).catch((err) => {
      console.error("[cloudinary-fake]", err);
      if (!res.headersSent) sendError(res, 500, "Internal error in the local Cloudinary fake");
      else res.destroy();
    });
  });

  async function route(req: http.IncomingMessage, res: http.ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://fake.invalid");
    const method = req.method ?? "GET";
    if (method === "OPTIONS") {
      res.writeHead(204, CORS_HEADERS);
      res.end();
      return;
    }

    let segments: string[];
    try {
      segments = url.pathname.split("/").filter(Boolean).map(decodeURIComponent);
    } catch {
      return sendError(res, 400, "Malformed URL");
    }

    if (segments.length === 0 && (method === "GET" || method === "HEAD")) {
      return sendJson(res, 200, { service: "cloudinary-fake", cloud_name: cloudName, assets: store.view().size });
    }

    // Upload API: /v1_1/<cloud>/<resource_type>/<action>
    if (segments[0] === "v1_1") {
      req.on("error", () => {});
      // Admin API ping (GET /v1_1/<cloud>/ping, Basic auth with the key and secret): "the service answers".
      if (method === "GET" && segments.length === 3 && segments[2] === "ping") {
        req.resume();
        if (segments[1] !== cloudName) return sendError(res, 401, `Invalid cloud_name ${segments[1]}`);
        const expected = `Basic ${Buffer.from(`${ctx.apiKey}:${ctx.apiSecret}`).toString("base64")}`;
        if (req.headers.authorization !== expected) return sendError(res, 401, "Invalid api_key or api_secret");
        return sendJson(res, 200, { status: "ok" });
      }
      if (method !== "POST") {
        req.resume();
        return sendError(res, 404, "Not found");
      }
      const [, cloud, resourceType, action] = segments;
      if (cloud !== cloudName) {
        req.resume();
        return sendError(res, 401, `Invalid cloud_name ${cloud}`);
      }
      // "auto" is what browsers usually post to; only images exist here, so it is "image".
      if ((resourceType === "image" || resourceType === "auto") && segments.length === 4) {
        if (action === "upload") return handleUpload(req, res, ctx);
        if (action === "destroy") return handleDestroy(req, res, ctx);
      }
      req.resume();
      return sendError(res, 404, `Not supported by the local Cloudinary fake: ${url.pathname}`);
    }

    // Delivery: /<cloud>/image/upload/...
    if ((method === "GET" || method === "HEAD") && segments[0] === cloudName && segments[1] === "image" && segments[2] === "upload") {
      if (segments.length < 4) return sendError(res, 404, "Resource not found");
      return handleDelivery(req, res, segments.slice(3), { store, cache });
    }

    req.resume();
    sendError(res, 404, "Not found");
  }

  const port = await listenOn(server, opts.port ?? 0, host);
  baseUrl = `http://${host}:${port}`;

  return {
    port,
    url: baseUrl,
    state: {
      cloudName,
      apiKey: ctx.apiKey,
      dataDir,
      assets: store.view(),
      async readOriginal(publicId) {
        const asset = store.get(publicId);
        return asset ? store.read(asset) : undefined;
      },
      derivedCacheSize: () => cache.size,
    },
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      if (ownsDir) await fs.rm(dataDir, { recursive: true, force: true });
    },
  };
}
