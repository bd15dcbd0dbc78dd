import "server-only";
// Order matters: the environment module must run before the SDK reads its configuration.
import "./cloudinary-env";
import { v2 as cloudinary } from "cloudinary";
import { ACCEPTED_IMAGE_MIME_TYPES, MAX_UPLOAD_BYTES } from "./image-limits";
import { PROBE_TIMEOUT_MS, cachedProbe } from "@/lib/health/cached-probe";

// The SDK waits a minute for an answer by default; a request that calls Cloudinary gives up
// after a few seconds instead (a photo removal then leaves a stray file, which costs little).
export const CLOUDINARY_TIMEOUT_MS = 5_000;

// The official SDK, configured from CLOUDINARY_URL alone: against the local fake its
// upload_prefix points at the fake; against Cloudinary itself there is none.

export interface CloudinarySettings {
  cloudName: string;
  apiKey: string;
  /** Where the upload API lives, e.g. http://127.0.0.1:12112 or https://api.cloudinary.com. */
  uploadPrefix: string;
  /** Host (and port) delivery URLs use when not Cloudinary's own CDN. */
  deliveryHost: string | null;
  secure: boolean;
}

export function cloudinarySettings(): CloudinarySettings {
  const c = cloudinary.config();
  const prefix = (c.upload_prefix as string | undefined) ?? "https://api.cloudinary.com";
  const local = Boolean(c.upload_prefix);
  return {
    cloudName: String(c.cloud_name),
    apiKey: String(c.api_key),
    uploadPrefix: prefix.replace(/\/+$/, ""),
    // The fake serves uploads and delivery from one address; real accounts deliver from Cloudinary's own delivery host.
    deliveryHost: local ? new URL(prefix).host : null,
    secure: !local || prefix.startsWith("https:"),
  };
}

/** Photos of a person's listings live under their own folder, so an upload names its uploader. */
export function uploadFolder(userId: string): string {
  return `listings/${userId}`;
}

export interface SignedUpload {
  upload_url: string;
  cloud_name: string;
  api_key: string;
  timestamp: number;
  folder: string;
  signature: string;
  max_bytes: number;
  accept: readonly string[];
}

/** Signs one browser upload into the person's folder (valid for Cloudinary's usual hour). */
export function signUpload(userId: string, now: Date = new Date()): SignedUpload {
  const settings = cloudinarySettings();
  const params = { timestamp: Math.floor(now.getTime() / 1000), folder: uploadFolder(userId) };
  const signature = cloudinary.utils.api_sign_request(params, String(cloudinary.config().api_secret));
  return {
    upload_url: cloudinary.utils.api_url("upload", { resource_type: "image" }),
    cloud_name: settings.cloudName,
    api_key: settings.apiKey,
    ...params,
    signature,
    max_bytes: MAX_UPLOAD_BYTES,
    accept: ACCEPTED_IMAGE_MIME_TYPES,
  };
}

// Present in the SDK's JavaScript (utils.verify_api_response_signature) but missing from its
// type definitions.
const utils = cloudinary.utils as unknown as {
  verify_api_response_signature(publicId: string, version: number, signature: string): boolean;
};

/** True when Cloudinary (or the fake, holding the same secret) really issued this upload result. */
export function verifyUploadResult(publicId: string, version: number, signature: string): boolean {
  return utils.verify_api_response_signature(publicId, version, signature.toLowerCase());
}

/** Removes an uploaded image. Best effort: a photo row is already gone, a stray file costs little. */
export async function destroyUpload(publicId: string): Promise<void> {
  try {
    // `timeout` is read by the SDK's uploader (lib/uploader.js) but missing from its types.
    const options = { resource_type: "image" as const, invalidate: true, timeout: CLOUDINARY_TIMEOUT_MS };
    await cloudinary.uploader.destroy(publicId, options);
  } catch (err) {
    console.warn("[cloudinary] could not remove", publicId, (err as Error)?.message ?? err);
  }
}

/** Whether the image service answers (its Admin API ping, with this account's key), asked at most every few seconds. */
export const probeMedia = cachedProbe(() => cloudinary.api.ping({ timeout: PROBE_TIMEOUT_MS }));
