import { invalidRequest } from "./errors";
import type { Metadata } from "./types";

// Parameters arrive form-encoded and parsed by qs, so every leaf is a string and arrays
// may come back as objects with "0", "1" keys. These helpers turn them into typed values
// and fail with the same kind of 400 Stripe gives, naming the parameter, so a typo in the
// app shows up here instead of only against the real API.

export type Params = Record<string, unknown>;

/**
 * Stripe rejects parameters it does not know. The fake does the same for top-level
 * names outside `allowed`, which lists what it models plus real Stripe parameters it
 * accepts and ignores; the message says where to widen the list if Stripe accepts it.
 */
export function rejectUnknown(params: Params, allowed: readonly string[]): void {
  for (const key of Object.keys(params)) {
    if (!allowed.includes(key) && key !== "expand") {
      throw invalidRequest(
        `Received unknown parameter: ${key}. (The local fake checks names against its own list in lib/fakes/stripe; widen it there if Stripe accepts this parameter.)`,
        { param: key },
      );
    }
  }
}

export function asObject(value: unknown, name: string): Params {
  if (value === undefined || value === "") return {};
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw invalidRequest(`Invalid object: ${name} must be a hash.`, { param: name });
  }
  return value as Params;
}

export function asArray(value: unknown, name: string): unknown[] {
  if (value === undefined || value === "") return [];
  if (Array.isArray(value)) return value;
  if (typeof value === "object" && value !== null) {
    const entries = Object.entries(value as Params);
    if (entries.every(([k]) => /^\d+$/.test(k))) {
      return entries.sort(([a], [b]) => Number(a) - Number(b)).map(([, v]) => v);
    }
  }
  throw invalidRequest(`Invalid array: ${name} must be an array.`, { param: name });
}

export function optString(params: Params, name: string, path = name): string | null {
  const value = params[name];
  if (value === undefined || value === "") return null;
  if (typeof value !== "string") {
    throw invalidRequest(`Invalid string: ${path} must be a string.`, { param: path });
  }
  return value;
}

export function reqString(params: Params, name: string, path = name): string {
  const value = optString(params, name, path);
  if (value === null) {
    throw invalidRequest(`Missing required param: ${path}.`, { param: path });
  }
  return value;
}

export function optInteger(params: Params, name: string, path = name, min = 0): number | null {
  const raw = optString(params, name, path);
  if (raw === null) return null;
  if (!/^-?\d+$/.test(raw)) {
    throw invalidRequest(`Invalid integer: ${raw}`, { param: path });
  }
  const n = Number(raw);
  if (!Number.isSafeInteger(n) || n < min) {
    throw invalidRequest(`This value must be greater than or equal to ${min}.`, { param: path });
  }
  return n;
}

export function reqInteger(params: Params, name: string, path = name, min = 0): number {
  const n = optInteger(params, name, path, min);
  if (n === null) throw invalidRequest(`Missing required param: ${path}.`, { param: path });
  return n;
}

export function optEnum<T extends string>(
  params: Params,
  name: string,
  values: readonly T[],
  path = name,
): T | null {
  const raw = optString(params, name, path);
  if (raw === null) return null;
  if (!values.includes(raw as T)) {
    throw invalidRequest(
      `Invalid ${path}: must be one of ${values.join(", ")}`,
      { param: path },
    );
  }
  return raw as T;
}

export function optBoolean(params: Params, name: string): boolean {
  const raw = optString(params, name);
  if (raw === null) return false;
  if (raw !== "true" && raw !== "false") {
    throw invalidRequest(`Invalid boolean: ${raw}`, { param: name });
  }
  return raw === "true";
}

export function currency(params: Params, name: string, path = name): string {
  const raw = reqString(params, name, path).toLowerCase();
  if (!/^[a-z]{3}$/.test(raw)) {
    throw invalidRequest(`Invalid currency: ${raw}.`, { param: path });
  }
  return raw;
}

// Stripe's documented metadata limits: 50 keys, key names up to 40 characters, values up
// to 500 characters (docs.stripe.com/api/metadata).
const METADATA_MAX_KEYS = 50;
const METADATA_MAX_KEY_LENGTH = 40;
const METADATA_MAX_VALUE_LENGTH = 500;

/** Metadata to merge: an empty string value means "remove this key", as on Stripe. */
export function metadata(params: Params, name: string, base: Metadata = {}, path = name): Metadata {
  const raw = asObject(params[name], path);
  const out: Metadata = { ...base };
  for (const [key, value] of Object.entries(raw)) {
    if (typeof value !== "string") {
      throw invalidRequest(`Invalid value for ${path}[${key}]: metadata values must be strings.`, {
        param: `${path}[${key}]`,
      });
    }
    if (key.length > METADATA_MAX_KEY_LENGTH || value.length > METADATA_MAX_VALUE_LENGTH) {
      throw invalidRequest(
        `Metadata keys can be up to ${METADATA_MAX_KEY_LENGTH} characters and values up to ${METADATA_MAX_VALUE_LENGTH}.`,
        { param: `${path}[${key}]` },
      );
    }
    if (value === "") delete out[key];
    else out[key] = value;
  }
  if (Object.keys(out).length > METADATA_MAX_KEYS) {
    throw invalidRequest(`Metadata can have up to ${METADATA_MAX_KEYS} keys.`, { param: path });
  }
  return out;
}

export function expandList(params: Params): string[] {
  return asArray(params.expand, "expand").filter((v): v is string => typeof v === "string");
}
