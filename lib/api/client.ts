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

export async function apiFetch<T = unknown>(path: string, opts: { method?: string; body?: unknown; signal?: AbortSignal } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: opts.method ?? (opts.body === undefined ? "GET" : "POST"),
      headers: opts.body === undefined ? undefined : { "content-type": "application/json" },
      body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
      signal: opts.signal,
      credentials: "same-origin",
    });
  } catch {
    throw new ApiClientError(0, "network", "We could not reach Duffbank. Check your connection and try again.");
  }
  const data = res.status === 204 ? null : await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error;
    throw new ApiClientError(res.status, e?.code ?? "internal", e?.message ?? "Something went wrong. Please try again.", e?.fields);
  }
  return data as T;
}
