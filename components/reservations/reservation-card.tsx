import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { ReservationView } from "@/lib/reservations/view";
import { quantityLabel } from "@/lib/reservations/labels";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { CANCEL_NOTICE_HOURS, STATUS_LABELS } from "@/lib/reservations/policy";
import { StatusBadge } from "./status-badge";
import { ReservationActions } from "./reservation-actions";
import { MessagesPanel } from "./message-thread";
import { ReviewForm } from "./review-form";
import { WORDS } from "./review-words";
import { OrderPanel } from "@/components/grower/order-panel";
import type { UnitSystem } from "@/lib/calc/units";

const BY = { gardener: "the gardener", supplier: "the supplier", duffbank: "Duffbank" } as const;

/** A posted live culture: where the parcel is, in place of the pickup time. */
function parcelStep(v: ReservationView): string | null {
  const mine = v.side === "gardener";
  if (v.status === "collected") return v.closed_at ? `Delivered ${formatLocal(v.closed_at)}.` : "Delivered.";
  if (v.status !== "confirmed") return null;
  switch (v.order?.stage) {
    case "paid":
      return mine ? `${v.supplier.name} packs it and posts it on one of their posting days.` : "Pack it, then mark it shipped with the carrier and tracking.";
    case "packed":
      return mine ? `Packed: it goes in the post on ${v.supplier.name}'s next posting day.` : "Packed: mark it shipped once it is in the post.";
    case "shipped":
      return mine ? `In the post with ${v.order.carrier}. Mark it arrived when it comes.` : "In the post; mark it delivered when the tracking says so, or the buyer will.";
    default:
      return null;
  }
}

function nextStep(v: ReservationView): string | null {
  const other = v.side === "gardener" ? v.supplier.name : v.gardener.name;
  if (v.order?.fulfilment === "post" && (v.status === "confirmed" || v.status === "collected")) return parcelStep(v);
  switch (v.status) {
    case "held":
      if (v.payment.state === "awaiting") {
        return v.side === "gardener"
          ? `Waiting for your ${v.amount_cents > 0 ? "payment" : "deposit"}: the hold ends ${formatLocal(v.hold_expires_at!)}.`
          : `Waiting for ${other}'s ${v.amount_cents > 0 ? "payment" : "deposit"}.`;
      }
      return v.side === "gardener" ? `Waiting for ${other} to accept, until ${formatLocal(v.hold_expires_at!)}.` : `Accept or decline by ${formatLocal(v.hold_expires_at!)}.`;
    case "confirmed":
      return v.pickup.starts_at ? `Pickup ${formatLocal(v.pickup.starts_at)} to ${formatLocal(v.pickup.ends_by!, undefined, { timeOnly: true })}.` : `Pickup by arrangement, before ${formatLocal(v.pickup.ends_by!)}.`;
    case "collected":
      return v.closed_at ? `Collected ${formatLocal(v.closed_at)}.` : "Collected.";
    case "cancelled":
      return `Cancelled by ${v.cancelled_by === v.side ? "you" : other}.`;
    default:
      return null;
  }
}

/** What cancelling does to the money, as the policy has it; a posted order can be cancelled only before it is packed. */
export function cancelNoteFor(v: Pick<ReservationView, "side" | "status" | "amount_cents" | "order">): string {
  if (v.side === "supplier") return "Everything the gardener paid or put down goes back to them in full.";
  if (v.status === "held") return "Nothing is charged: any payment or deposit hold goes back in full.";
  if (v.order?.fulfilment === "post") return "Cancelling the order before it is packed returns everything you paid.";
  return `Cancelling at least ${CANCEL_NOTICE_HOURS} hours before the pickup returns everything; later, ${v.amount_cents > 0 ? "the payment is not refunded" : "the deposit is kept"}.`;
}

function moneyLine(v: ReservationView): string | null {
  const price = v.amount_cents > 0;
  const cents = price ? v.amount_cents : v.deposit_cents;
  if (cents === 0) return null;
  const money = formatMoney(cents, v.currency);
  switch (v.payment.state) {
    case "awaiting":
      // A reservation that ended before anything was paid owes nothing any more.
      if (v.status !== "held") return "Nothing paid";
      return price ? `${money} to pay` : `${money} deposit to place`;
    case "unpaid":
      return "Nothing paid; the payment page was closed";
    case "paid":
      return `${money} paid`;
    case "authorised":
      return `${money} deposit on hold (not taken)`;
    case "released":
      return `${money} deposit released`;
    case "captured":
      return `${money} deposit kept`;
    case "refunded":
      return `${formatMoney(v.payment.refunded_cents || cents, v.currency)} refunded`;
    default:
      return null;
  }
}

export function ReservationCard({ v, system = "metric" }: { v: ReservationView; system?: UnitSystem }) {
  const titleId = `r-${v.id}-title`;
  const other = v.side === "gardener" ? v.supplier.name : v.gardener.name;
  const otherId = v.side === "gardener" ? v.supplier.id : v.gardener.id;
  const step = nextStep(v);
  const money = moneyLine(v);
  const cancelNote = cancelNoteFor(v);
  return (
    <article id={`r-${v.id}`} aria-labelledby={titleId} className="flex scroll-mt-24 flex-col gap-4 rounded-leaf bg-white p-5 ring-1 ring-humus-200">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={titleId} className="text-lg font-semibold">
            {quantityLabel(v.quantity, v.unit, system)} of {v.listing.title}
          </h2>
          <p className="text-sm text-humus-700">
            {v.side === "gardener" ? `From ${v.supplier.name}` : `For ${v.gardener.name}`} ·{" "}
            <Link href={`/report?user=${encodeURIComponent(otherId)}`} className="text-humus-600 underline underline-offset-2 hover:text-ember-700" data-testid="report-person">
              Report this person<span className="sr-only"> ({other})</span>
            </Link>
          </p>
        </div>
        <StatusBadge status={v.status} />
      </header>

      {step ? <p>{step}</p> : null}

      {v.pickup_code ? (
        <div className="flex flex-wrap items-center gap-4 rounded-lg bg-moss-50 p-4 ring-1 ring-moss-200">
          <div>
            <p className="text-sm font-medium text-moss-800">Your pickup code</p>
            <p className="font-mono text-3xl font-bold tracking-[0.3em]" data-testid="pickup-code">
              {v.pickup_code}
            </p>
          </div>
          <p className="max-w-sm text-sm text-humus-700">Show it to {v.supplier.name} when you collect. It proves the pickup is yours.</p>
        </div>
      ) : null}

      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        {v.pickup.window ? (
          <>
            <dt className="font-medium text-humus-600">Pickup window</dt>
            <dd>{v.pickup.window}</dd>
          </>
        ) : null}
        {v.pickup.address ? (
          <>
            <dt className="font-medium text-humus-600">Address</dt>
            <dd data-testid="pickup-address">{v.pickup.address}</dd>
          </>
        ) : v.side === "gardener" && v.status === "held" && v.order?.fulfilment !== "post" ? (
          <>
            <dt className="font-medium text-humus-600">Address</dt>
            <dd>Sent to you once {v.supplier.name} accepts.</dd>
          </>
        ) : null}
        {(v.side === "gardener" ? v.supplier.email : v.gardener.email) ? (
          <>
            <dt className="font-medium text-humus-600">Contact</dt>
            <dd>
              {other}, <a className="text-moss-700 underline" href={`mailto:${v.side === "gardener" ? v.supplier.email : v.gardener.email}`}>{v.side === "gardener" ? v.supplier.email : v.gardener.email}</a>
            </dd>
          </>
        ) : null}
        {money ? (
          <>
            <dt className="font-medium text-humus-600">Money</dt>
            <dd>{money}</dd>
          </>
        ) : null}
      </dl>

      <OrderPanel v={v} />

      {v.payment.notice && v.payment.checkout === "not_opened" ? (
        <p role="alert" className="rounded-lg bg-litter-100 p-3 text-sm text-humus-900 ring-1 ring-litter-300" data-testid="payment-notice">
          {v.payment.notice}
        </p>
      ) : null}

      {v.payment.problem ? (
        <p role="alert" className="rounded-lg bg-ember-100 p-3 text-sm text-ember-800">
          The last card attempt did not go through: {v.payment.problem} Try again with another card.
        </p>
      ) : null}

      <ReservationActions id={v.id} side={v.side} actions={v.actions} canPay={v.can_pay} payAgain={v.payment.checkout === "not_opened"} cancelNote={cancelNote} posted={v.order?.fulfilment === "post"} />

      {v.can_review ? <ReviewForm id={v.id} subject={other} /> : null}
      {v.my_review ? <p className="text-sm">You gave {other} {v.my_review.rating} of 5 ({WORDS[v.my_review.rating].toLowerCase()}){v.my_review.comment ? `: “${v.my_review.comment}”` : "."}</p> : null}
      {v.their_review ? <p className="text-sm">{other} gave you {v.their_review.rating} of 5 ({WORDS[v.their_review.rating].toLowerCase()}){v.their_review.comment ? `: “${v.their_review.comment}”` : "."}</p> : null}

      <MessagesPanel id={v.id} otherName={other} closed={v.status === "expired"} />

      <details className="rounded-lg ring-1 ring-humus-200">
        <summary className="flex min-h-11 cursor-pointer items-center px-3 font-medium">Status history</summary>
        <ol className="flex flex-col gap-1 border-t border-humus-200 p-3 text-sm">
          {v.history.map((h, i) => (
            <li key={i}>
              <span className="text-humus-600">{formatLocal(h.at)}</span> · {h.from === h.to ? (h.note ?? "Updated") : h.from ? STATUS_LABELS[h.to as keyof typeof STATUS_LABELS] : "Reserved"}
              {h.by !== "duffbank" ? ` by ${h.by === v.side ? "you" : BY[h.by]}` : ""}
              {h.note && h.from !== h.to ? ` — ${h.note}` : ""}
            </li>
          ))}
        </ol>
      </details>
    </article>
  );
}
