"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { isApiError } from "@/lib/api/client";
import { useReserveAll } from "./use-match";

/** Hands every pickup of the plan to the reservation flow in one request. */
export function ReserveAll({ items, bedId }: { items: { listing_id: string; quantity: number }[]; bedId?: string }) {
  const router = useRouter();
  const reserve = useReserveAll();
  const [error, setError] = useState<string | null>(null);

  const onClick = async () => {
    setError(null);
    try {
      const answer = await reserve.mutateAsync({ items, ...(bedId ? { bed_id: bedId } : {}) });
      // Prices and deposits are paid on the payment page, which comes back to the
      // reservations; with nothing to pay, straight there.
      if (answer?.checkout_url) window.location.assign(answer.checkout_url);
      else router.push("/reservations");
    } catch (err) {
      if (isApiError(err) && err.status === 401) {
        router.push(`/sign-in?callbackUrl=${encodeURIComponent(window.location.pathname + window.location.search)}`);
        return;
      }
      setError(isApiError(err) ? err.message : "Reserving failed. Please try again.");
    }
  };

  return (
    <div className="flex flex-col gap-2">
      {error ? <Notice tone="error" title="Nothing was reserved">{error}</Notice> : null}
      <Button onClick={onClick} disabled={reserve.isPending || !items.length} className="self-start">
        {reserve.isPending ? "Reserving…" : `Reserve all ${items.length} pickups`}
      </Button>
      <p className="text-sm text-humus-600">Each supplier holds your share and confirms; deposits and prices are taken at the next step.</p>
    </div>
  );
}
