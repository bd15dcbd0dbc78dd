// Request signing as Cloudinary documents it ("Generating authentication signatures",
// cloudinary.com/documentation/authentication_signatures): every parameter except file,
// cloud_name, resource_type and api_key, sorted by name, joined as k=v with "&", the API
// secret appended, then SHA-1 (or SHA-256 if the account is set to it), hex.
//
// One detail comes from the Node SDK (cloudinary 2.x, utils.api_string_to_sign): with
// its default signature_version 2 it escapes "&" inside each k=v pair as %26, so a value
// containing "&" cannot be re-split into extra parameters. The fake signs the same way so
// SDK uploads verify; for values without "&" both versions give the same string.

import crypto from "node:crypto";

export type SignatureAlgorithm = "sha1" | "sha256";

export const UNSIGNED_PARAMS = new Set(["file", "cloud_name", "resource_type", "api_key", "signature"]);

/** Cloudinary's documented validity of a signed request: one hour from its timestamp. */
export const SIGNATURE_MAX_AGE_SECONDS = 60 * 60;

export function stringToSign(params: Record<string, string | number | undefined>): string {
  return Object.entries(params)
    .filter(([k, v]) => !UNSIGNED_PARAMS.has(k) && v !== undefined && v !== null && String(v) !== "")
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`.replace(/&/g, "%26"))
    .join("&");
}

export function signParams(
  params: Record<string, string | number | undefined>,
  apiSecret: string,
  algorithm: SignatureAlgorithm = "sha1",
): string {
  return crypto.createHash(algorithm).update(stringToSign(params) + apiSecret).digest("hex");
}

/** The signature Cloudinary puts in an upload response (SDK: verify_api_response_signature). */
export function responseSignature(publicId: string, version: number, apiSecret: string): string {
  return crypto.createHash("sha1").update(`public_id=${publicId}&version=${version}${apiSecret}`).digest("hex");
}

export interface SignedRequestRules {
  apiKey: string;
  apiSecret: string;
  algorithm: SignatureAlgorithm;
  nowSeconds: number;
}

export type VerifyResult = { ok: true } | { ok: false; status: 400 | 401; message: string };

function formatUtc(seconds: number): string {
  return new Date(seconds * 1000).toISOString().replace("T", " ").replace(/\.\d+Z$/, " +0000");
}

function safeEqualHex(a: string, b: string): boolean {
  const ab = Buffer.from(a.toLowerCase());
  const bb = Buffer.from(b.toLowerCase());
  return ab.length === bb.length && crypto.timingSafeEqual(ab, bb);
}

/** Checks api_key, signature and timestamp age. Error texts follow Cloudinary's wording. */
export function verifySignedRequest(fields: Record<string, string>, rules: SignedRequestRules): VerifyResult {
  if (!fields.api_key) return { ok: false, status: 401, message: "Must supply api_key" };
  if (fields.api_key !== rules.apiKey) {
    return { ok: false, status: 401, message: `Unknown API key ${fields.api_key}` };
  }
  if (!fields.timestamp) return { ok: false, status: 400, message: "Missing required parameter - timestamp" };
  if (!/^\d{1,12}$/.test(fields.timestamp)) {
    return { ok: false, status: 400, message: `Invalid timestamp ${fields.timestamp}` };
  }

  const expected = signParams(fields, rules.apiSecret, rules.algorithm);
  const given = fields.signature ?? "";
  if (!given || !safeEqualHex(given, expected)) {
    return {
      ok: false,
      status: 401,
      message: `Invalid Signature ${given || "(none given)"}. String to sign - '${stringToSign(fields)}'.`,
    };
  }

  // Checked after the signature so only a genuinely signed request learns it is stale.
  const ts = Number(fields.timestamp);
  if (rules.nowSeconds - ts > SIGNATURE_MAX_AGE_SECONDS) {
    return {
      ok: false,
      status: 400,
      message: `Stale request - reported time is ${formatUtc(ts)} which is more than 1 hour ago`,
    };
  }
  // Not documented by Cloudinary; refused here so a signature cannot be minted to stay
  // valid for days by dating it in the future.
  if (ts - rules.nowSeconds > SIGNATURE_MAX_AGE_SECONDS) {
    return {
      ok: false,
      status: 400,
      message: `Stale request - reported time is ${formatUtc(ts)} which is more than 1 hour in the future`,
    };
  }
  return { ok: true };
}
