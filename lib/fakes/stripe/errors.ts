import { randomBytes } from "node:crypto";

// The SDK turns an error body into a typed exception by HTTP status and `type`
// (stripe/esm/Error.js generateV1Error): 400/404 → StripeInvalidRequestError (or
// StripeIdempotencyError when type is idempotency_error), 401 → StripeAuthenticationError,
// 402 → StripeCardError. So each error here carries both, chosen to match what Stripe answers.

export type StripeErrorType =
  | "invalid_request_error"
  | "idempotency_error"
  | "card_error"
  | "api_error";

export interface StripeErrorBody {
  type: StripeErrorType;
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
  payment_intent?: unknown;
  charge?: string;
  doc_url?: string;
}

export class FakeStripeError extends Error {
  constructor(
    readonly status: number,
    readonly body: StripeErrorBody,
  ) {
    super(body.message);
  }
}

export function invalidRequest(message: string, extra: Partial<StripeErrorBody> = {}) {
  return new FakeStripeError(400, { type: "invalid_request_error", message, ...extra });
}

export function missingResource(kind: string, id: string, param = "id") {
  return new FakeStripeError(404, {
    type: "invalid_request_error",
    code: "resource_missing",
    param,
    message: `No such ${kind}: '${id}'`,
  });
}

export function unexpectedState(message: string) {
  return invalidRequest(message, { code: "payment_intent_unexpected_state" });
}

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

/** Random base62 text; Stripe ids are opaque, only the prefix carries meaning. */
export function randomToken(length: number): string {
  const bytes = randomBytes(length);
  let out = "";
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return out;
}

export function newId(prefix: string): string {
  return `${prefix}${randomToken(24)}`;
}
