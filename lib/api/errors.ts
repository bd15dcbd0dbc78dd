import { z } from "zod";

/** The closed list of error codes and the HTTP status each one answers with. */
export const ERROR_STATUS = {
  bad_request: 400,
  invalid_input: 422,
  unauthenticated: 401,
  forbidden: 403,
  suspended: 403,
  not_found: 404,
  method_not_allowed: 405,
  conflict: 409,
  invalid_state: 409,
  insufficient_quantity: 409,
  slot_full: 409,
  household_limit: 409,
  // Idempotency-Key (lib/api/idempotency.ts): the key was used for another request, or its first request still runs.
  idempotency_mismatch: 409,
  request_in_progress: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;
export type FieldErrors = Record<string, string>;

export interface ErrorEnvelope {
  error: { code: ErrorCode; message: string; fields?: FieldErrors };
}

export class ApiError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    /** For rate_limited: seconds until trying again is worth it (sent as Retry-After). */
    readonly retryAfterS?: number,
  ) {
    super(message);
    this.name = "ApiError";
  }
  get status(): number {
    return ERROR_STATUS[this.code];
  }
  toEnvelope(): ErrorEnvelope {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

/** One message per field, keyed by the dotted path ("bed.length_m", "components.0.mass_kg"). */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    // A key a strict object does not know is a field of its own: put the message beside it.
    const paths = issue.code === "unrecognized_keys" ? issue.keys.map((k) => [...issue.path, k]) : [issue.path];
    for (const path of paths) {
      const key = path.length ? path.map(String).join(".") : "_";
      if (!fields[key]) fields[key] = issue.message;
    }
  }
  return fields;
}

export function fromZod(error: z.ZodError, message = "Some fields need another look."): ApiError {
  return new ApiError("invalid_input", message, fieldErrors(error));
}

/** Parse with a shared schema, turning failure into a 422 with a message per field. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const result = schema.safeParse(input);
  if (!result.success) throw fromZod(result.error);
  return result.data;
}

export const notFound = (what = "That") => new ApiError("not_found", `${what} was not found.`);
