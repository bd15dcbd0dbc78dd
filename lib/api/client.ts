import type { ErrorCode, FieldErrors } from "./errors";

/** What apiFetch throws: the server's error envelope, so UI code can branch on `code`. */
export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | "network",
    message: string,
    readonly fields?: FieldErrors,
  ) {
    super(message);
  }
}

export function isApiError(err: unknown): err is ApiClientError {
  return err instanceof ApiClientError;
}

export interface FetchOptions {
  method?: string;
  body?: unknown;
  signal?: AbortSignal;
  /**
   * Sent as the Idempotency-Key header: the server answers a repeat with the first answer.
   * With a key, a request whose answer was lost on the way (a dropped connection) is sent
   * again, twice at most, and so is one the server says is still busy with the first.
   */
  idempotencyKey?: string;
}

// Waits before each resend of a keyed request (a dropped connection, or the first still running).
const RESEND_AFTER_MS = [500, 1500, 3000];

export async function apiFetch<T = unknown>(path: string, opts: FetchOptions = {}): Promise<T> {
  const headers: Record<string, string> = {};
  if (opts.body !== undefined) headers["content-type"] = "application/json";
  if (opts.idempotencyKey) headers["idempotency-key"] = opts.idempotencyKey;
  const send = () =>
    fetch(path, {
      method: opts.method ?? (opts.body === undefined ? "GET" : "POST"),
      headers,
      body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
      signal: opts.signal,
      credentials: "same-origin",
    });
  let res: Response | null = null;
  for (let attempt = 0; ; attempt++) {
    const again = opts.idempotencyKey && attempt < RESEND_AFTER_MS.length && !opts.signal?.aborted;
    try {
      res = await send();
    } catch {
      res = null;
    }
    const busy = res?.status === 409 && (await res.clone().json().catch(() => null))?.error?.code === "request_in_progress";
    if ((res && !busy) || !again) break;
    await new Promise((r) => setTimeout(r, RESEND_AFTER_MS[attempt]));
  }
  if (!res) throw new ApiClientError(0, "network", "We could not reach Duffbank. Check your connection and try again.");
  const data = res.status === 204 ? null : await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error;
    throw new ApiClientError(res.status, e?.code ?? "internal", e?.message ?? "Something went wrong. Please try again.", e?.fields);
  }
  return data as T;
}

/** A random UUID; randomUUID exists only on secure pages (https or localhost), getRandomValues everywhere. */
function newKey(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6] & 0x0f) | 0x40; // version 4
  b[8] = (b[8] & 0x3f) | 0x80; // RFC 4122 variant
  const hex = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

/**
 * One Idempotency-Key per submit. The key is kept only while the same request is sent again
 * without an answer having come back (the connection dropped), so pressing the button again
 * then cannot reserve or book twice; once an answer arrives, the next submit gets a new key.
 */
export class SubmitKeys {
  private last: { request: string; key: string } | null = null;

  keyFor(path: string, body: unknown): string {
    const request = `${path} ${JSON.stringify(body ?? null)}`;
    if (this.last?.request !== request) this.last = { request, key: newKey() };
    return this.last.key;
  }

  /** Call with what came back: only a lost answer keeps the key. */
  settle(err?: unknown) {
    if (!(err instanceof ApiClientError && err.code === "network")) this.last = null;
  }
}

/** apiFetch with a submit's Idempotency-Key from `keys`, settled by the outcome. */
export async function submitOnce<T = unknown>(keys: SubmitKeys, path: string, opts: Omit<FetchOptions, "idempotencyKey"> = {}): Promise<T> {
  try {
    const out = await apiFetch<T>(path, { ...opts, idempotencyKey: keys.keyFor(`${opts.method ?? "POST"} ${path}`, opts.body) });
    keys.settle();
    return out;
  } catch (err) {
    keys.settle(err);
    throw err;
  }
}
