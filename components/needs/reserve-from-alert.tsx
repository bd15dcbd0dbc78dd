"use client";
import { formatMoney } from "@/lib/format/money";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { isApiError, submitOnce } from "@/lib/api/client";
import { quantityLabel } from "@/lib/reservations/labels";
import { listingPrice } from "@/lib/payments/money";
import { packCount, packsCovering, type Pack } from "@/lib/listings/packs";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useSubmitKeys } from "@/components/ui/use-submit-keys";

type Answer = { reservation: { id: string }; checkout_url?: string };

/**
 * One click: reserve what the need still lacks, for the same bed (so the bed's plan keeps it)
 * and the same need (so it counts towards it), at the listing's next pickup time.
 */
export function ReserveFromAlert(props: {
  listingId: string;
  needId: string;
  bedId: string | null;
  bedName: string | null;
  amount: number;
  unit: string;
  priceCents: number;
  /** Sold by the pack: `amount` is whole packs, charged at the pack price. */
  pack?: Pack | null;
  depositCents: number;
  currency: string;
  window: { id: string; label: string; next_start: string } | null;
}) {
  const router = useRouter();
  // One Idempotency-Key per click: a retry after a lost answer cannot reserve twice.
  const keys = useSubmitKeys();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const what = props.pack ? `${packCount(packsCovering(props.amount, props.pack))} (${quantityLabel(props.amount, props.unit)})` : quantityLabel(props.amount, props.unit);
  const money = props.priceCents > 0 ? ` and pay ${formatMoney(listingPrice({ price_cents: props.priceCents, pack: props.pack }, props.amount), props.currency)}` : props.depositCents > 0 ? ` with a ${formatMoney(props.depositCents, props.currency)} deposit` : "";

  async function reserve() {
    setBusy(true);
    setError(null);
    try {
      const answer = await submitOnce<Answer>(keys, "/api/reservations", {
        body: { listing_id: props.listingId, quantity: props.amount, need_id: props.needId, bed_id: props.bedId, pickup_window_id: props.window?.id ?? null },
      });
      if (answer.checkout_url) window.location.assign(answer.checkout_url);
      else router.push(`/reservations?new=${answer.reservation.id}#r-${answer.reservation.id}`);
    } catch (err) {
      setError(isApiError(err) ? err.message : "We could not reserve it. Please try again.");
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      {error ? <Notice tone="error" title="Nothing was reserved">{error}</Notice> : null}
      <p className="text-sm text-humus-700">
        {props.window ? `Pickup: ${props.window.label}, next ${formatLocal(props.window.next_start)}.` : "No fixed pickup time: you agree one with the supplier in the messages."}
        {props.bedName ? ` Reserved for ${props.bedName}, so it stays with that bed's plan.` : ""}
      </p>
      <Button onClick={() => void reserve()} disabled={busy} className="self-start">
        {busy ? "Reserving…" : `Reserve ${what}${money}`}
      </Button>
    </div>
  );
}
