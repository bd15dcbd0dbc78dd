"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch, isApiError, submitOnce, type ApiClientError } from "@/lib/api/client";
import { useSubmitKeys } from "./use-submit-keys";

/**
 * One button's call to the API: busy while it runs, the server's message when it fails,
 * and the page's server data refreshed when it succeeds.
 */
export function useApiAction() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string> | undefined>(undefined);
  const keys = useSubmitKeys();
  async function run<T = unknown>(
    path: string,
    // idempotent: the route moves money and honours an Idempotency-Key; one is sent per press.
    opts: { method?: string; body?: unknown; idempotent?: boolean; onFields?: (fields: Record<string, string>) => void } = {},
    after?: (result: T) => void,
  ): Promise<T | undefined> {
    setBusy(true);
    setError(null);
    setFields(undefined);
    try {
      const request = { method: opts.method, body: opts.body };
      const result = opts.idempotent ? await submitOnce<T>(keys, path, request) : await apiFetch<T>(path, request);
      after?.(result);
      router.refresh();
      return result;
    } catch (err) {
      setError(isApiError(err) ? err.message : "That did not work. Please try again.");
      const f = isApiError(err) ? (err as ApiClientError).fields : undefined;
      setFields(f);
      if (f) opts.onFields?.(f);
      return undefined;
    } finally {
      setBusy(false);
    }
  }
  return { run, busy, error, fields, setError };
}
