import type { IncomingMessage, ServerResponse } from "node:http";
import { FakeStripeError } from "./errors";
import type { FakeStripeState, IdempotentEntry } from "./types";

// Request plumbing shared by the API and the hosted page: body reading, replies, the API
// key check and idempotency, each following what Stripe documents for its API.

// Stripe's own request size limit is far larger; this only stops a runaway client.
const MAX_BODY_BYTES = 1024 * 1024;

export async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > MAX_BODY_BYTES) throw new FakeStripeError(413, { type: "invalid_request_error", message: "Request body too large." });
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

export function sendJson(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, {
    "Content-Type": "application/json",
    "Content-Length": Buffer.byteLength(text),
    "Cache-Control": "no-cache, no-store",
    ...headers,
  });
  res.end(text);
}

/**
 * `redirectTo`: origins the page's form may end up at. Browsers apply form-action to the
 * redirect after a POST too, so the pay form must allow the app's success_url origin or
 * Chromium blocks the 303 back to the app.
 */
export function sendHtml(res: ServerResponse, status: number, html: string, redirectTo: string[] = []): void {
  const formAction = ["'self'", ...redirectTo].join(" ");
  res.writeHead(status, {
    "Content-Type": "text/html; charset=utf-8",
    "Content-Length": Buffer.byteLength(html),
    "Cache-Control": "no-store",
    // The page needs nothing from anywhere else; say so, so a stray remote asset fails loudly.
    "Content-Security-Policy": `default-src 'none'; style-src 'unsafe-inline'; form-action ${formAction}; base-uri 'none'`,
  });
  res.end(html);
}

function mask(key: string): string {
  return key.length <= 8 ? "****" : `${key.slice(0, 8)}****${key.slice(-4)}`;
}

/**
 * Stripe takes the secret key as a Bearer token (what the SDK sends) or as the Basic
 * auth user name (what `curl -u sk_test_...:` sends). Any test-mode secret key is
 * accepted because the fake has one shared account; live keys are refused so a real
 * key pasted into development config is noticed rather than silently used.
 */
export function authenticate(req: IncomingMessage): string {
  const header = req.headers.authorization ?? "";
  let key = "";
  if (/^Bearer /i.test(header)) key = header.slice(7).trim();
  else if (/^Basic /i.test(header)) key = Buffer.from(header.slice(6).trim(), "base64").toString("utf8").split(":")[0];
  if (key === "") {
    throw new FakeStripeError(401, {
      type: "invalid_request_error",
      message:
        "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    });
  }
  if (!/^sk_test_[A-Za-z0-9_]+$/.test(key)) {
    throw new FakeStripeError(401, {
      type: "invalid_request_error",
      message: `Invalid API Key provided: ${mask(key)}. The local fake accepts any secret test key (sk_test_...).`,
    });
  }
  return key;
}

/** Key-order-independent JSON, so the same parameters always compare equal. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value);
}

// Stripe limits idempotency keys to 255 characters (docs.stripe.com/api/idempotent_requests).
const MAX_KEY_LENGTH = 255;

/**
 * Looks up an earlier answer for this key. Same endpoint and parameters → that answer
 * (to replay); anything else under the same key → Stripe's idempotency_error.
 * Keys never expire here (Stripe prunes them after 24 hours).
 */
export function findIdempotent(
  state: FakeStripeState,
  key: string,
  method: string,
  path: string,
  paramsJson: string,
): IdempotentEntry | null {
  if (key.length > MAX_KEY_LENGTH) {
    throw new FakeStripeError(400, {
      type: "invalid_request_error",
      message: `Invalid idempotency key: must be at most ${MAX_KEY_LENGTH} characters.`,
    });
  }
  const entry = state.idempotency.get(key);
  if (!entry) return null;
  if (entry.method !== method || entry.path !== path) {
    throw new FakeStripeError(400, {
      type: "idempotency_error",
      message: `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${entry.method} ${entry.path}' vs '${method} ${path}'). Try using a key other than '${key}' if you meant to execute a different request.`,
    });
  }
  if (entry.paramsJson !== paramsJson) {
    throw new FakeStripeError(400, {
      type: "idempotency_error",
      message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
    });
  }
  return entry;
}

/**
 * Stripe saves the result once the endpoint has started doing its work; a request
 * rejected for bad parameters is not saved and may be retried with the same key. The fake
 * approximates that by saving successes and card declines (402), which are results of
 * doing the work, and not other errors.
 */
export function shouldSaveIdempotent(status: number): boolean {
  return (status >= 200 && status < 300) || status === 402;
}
