"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorSummary, type SummaryItem } from "@/components/ui/error-summary";
import { isApiError } from "@/lib/api/client";
import { useReserveAll, type ReserveAllItem } from "./use-match";

/** What went wrong with each stop, by listing id, as the reservation API said it. */
export type StopProblems = Record<string, string[]>;

/** The API names an item's field "items.2.quantity": the stop is the third item sent. */
export function problemsByListing(fields: Record<string, string> | undefined, sent: readonly { listing_id: string }[]): { byListing: StopProblems; general: string[] } {
  const byListing: StopProblems = {};
  const general: string[] = [];
  for (const [key, message] of Object.entries(fields ?? {})) {
    const m = /^items\.(\d+)(?:\.|$)/.exec(key);
    const item = m ? sent[Number(m[1])] : undefined;
    if (item) (byListing[item.listing_id] ??= []).push(message);
    else general.push(message);
  }
  return { byListing, general };
}

/**
 * Hands every pickup and parcel of the plan to the reservation flow in one request, all or
 * nothing. When some stops cannot be reserved, each one's own message is shown beside it
 * (`onProblems`) and the gardener may reserve the others only, if they agree to a partial plan.
 */
export function ReserveAll({
  items,
  bedId,
  names,
  onProblems,
  problems,
}: {
  items: ReserveAllItem[];
  bedId?: string;
  /** What to call each stop in the summary, by listing id ("Stop 2: Wheat straw"). */
  names: Record<string, string>;
  onProblems: (p: StopProblems) => void;
  problems: StopProblems;
}) {
  const router = useRouter();
  const reserve = useReserveAll();
  const [message, setMessage] = useState<string | null>(null);
  const [attempt, setAttempt] = useState(0);

  const send = async (chosen: ReserveAllItem[]) => {
    setMessage(null);
    onProblems({});
    try {
      const answer = await reserve.mutateAsync({ items: chosen, ...(bedId ? { bed_id: bedId } : {}) });
      // Prices and deposits are paid on the payment page, which comes back to the
      // reservations; with nothing to pay, straight there.
      if (answer?.checkout_url) window.location.assign(answer.checkout_url);
      else router.push("/reservations");
    } catch (err) {
      if (isApiError(err) && err.status === 401) {
        router.push(`/sign-in?callbackUrl=${encodeURIComponent(window.location.pathname + window.location.search)}`);
        return;
      }
      const { byListing, general } = problemsByListing(isApiError(err) ? err.fields : undefined, chosen);
      onProblems(byListing);
      // The server's own words, as sent; a stop's own message also goes beside the stop.
      setMessage([isApiError(err) ? err.message : "Reserving failed. Please try again.", ...general].join(" "));
      setAttempt((a) => a + 1);
    }
  };

  const failing = items.filter((i) => problems[i.listing_id]?.length);
  const fine = items.filter((i) => !problems[i.listing_id]?.length);
  const summaryItems: SummaryItem[] = failing.flatMap((i) => problems[i.listing_id].map((m) => ({ target: `stop-${i.listing_id}`, message: `${names[i.listing_id] ?? "A stop"}: ${m}` })));

  return (
    <div className="flex flex-col gap-3">
      <ErrorSummary title="Nothing was reserved" message={message} items={summaryItems} attempt={attempt} />
      {failing.length && fine.length ? (
        <div className="flex flex-col gap-2 rounded-lg bg-litter-100 p-3 ring-1 ring-litter-300">
          <p className="text-sm">
            You can put right what is marked and reserve everything again, or reserve the other {fine.length} {fine.length === 1 ? "pickup" : "pickups"} now and leave out{" "}
            {failing.length === 1 ? "the one with a problem" : `the ${failing.length} with a problem`}: the plan is then only partly covered.
          </p>
          <Button variant="secondary" onClick={() => send(fine)} disabled={reserve.isPending} className="self-start">
            Reserve the other {fine.length} only
          </Button>
        </div>
      ) : null}
      <Button onClick={() => send(items)} disabled={reserve.isPending || !items.length} className="self-start">
        {reserve.isPending ? "Reserving…" : `Reserve all ${items.length} ${items.length === 1 ? "pickup" : "pickups"}`}
      </Button>
      <p className="text-sm text-humus-600">All or nothing: each supplier holds your share and answers; deposits and prices are taken at the next step.</p>
    </div>
  );
}
