"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { isApiError, submitOnce, type ApiClientError } from "@/lib/api/client";
import { useSubmitKeys } from "@/components/ui/use-submit-keys";

/** Runs one POST on a reservation, then refreshes the page's server data. */
export function useReservationAction(id: string) {
  const router = useRouter();
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<ApiClientError | Error | null>(null);
  const keys = useSubmitKeys();
  const run = async <T = unknown>(path: string, body: unknown = {}): Promise<T | null> => {
    setBusy(path);
    setError(null);
    try {
      // Each step moves money: one Idempotency-Key per press, so a lost answer cannot do it twice.
      const out = await submitOnce<T>(keys, `/api/reservations/${id}/${path}`, { method: "POST", body });
      router.refresh();
      return out;
    } catch (err) {
      setError(isApiError(err) ? err : new Error("That did not work. Please try again."));
      return null;
    } finally {
      setBusy(null);
    }
  };
  return { run, busy, error };
}
