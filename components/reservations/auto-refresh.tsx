"use client";
import { useEffect } from "react";
import { useRouter } from "next/navigation";

/** Re-reads the page's server data every few seconds while we wait on Stripe's webhook. */
export function AutoRefresh({ everyMs = 2000, forMs = 60_000 }: { everyMs?: number; forMs?: number }) {
  const router = useRouter();
  useEffect(() => {
    const started = Date.now();
    const t = setInterval(() => {
      if (Date.now() - started > forMs) clearInterval(t);
      else router.refresh();
    }, everyMs);
    return () => clearInterval(t);
  }, [router, everyMs, forMs]);
  return null;
}
