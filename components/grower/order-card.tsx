import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import { quantityLabel } from "@/lib/reservations/labels";
import { formatLocal } from "@/lib/reservations/pickup-times";
import type { ReservationView } from "@/lib/reservations/view";
import { ReservationActions } from "@/components/reservations/reservation-actions";
import { OrderPanel } from "./order-panel";
import type { UnitSystem } from "@/lib/calc/units";

function waiting(v: ReservationView): string | null {
  if (v.status !== "held") return null;
  return v.payment.state === "paid" ? `Paid: accept it by ${formatLocal(v.hold_expires_at!)}, or decline for a full refund.` : `Accept or decline by ${formatLocal(v.hold_expires_at!)}.`;
}

/** One open order on the grower's dashboard: who, what, where it goes, and the next step. */
export function OrderCard({ v, system = "metric" }: { v: ReservationView; system?: UnitSystem }) {
  const titleId = `o-${v.id}-title`;
  const note = waiting(v);
  const paid = v.amount_cents > 0 && ["paid", "refunded"].includes(v.payment.state) ? `${formatMoney(v.amount_cents, v.currency)} ${v.payment.state}` : null;
  return (
    <article id={`o-${v.id}`} aria-labelledby={titleId} className="flex scroll-mt-24 flex-col gap-3 border-t border-humus-100 pt-4 first:border-0 first:pt-0" data-order={v.id}>
      <header className="flex flex-col gap-0.5">
        <h3 id={titleId} className="font-semibold">
          {quantityLabel(v.quantity, v.unit, system)} of {v.listing.title}
        </h3>
        <p className="text-sm text-humus-700">
          For {v.gardener.name} · ordered {formatLocal(v.created_at)}
          {paid ? ` · ${paid}` : ""}
        </p>
      </header>
      {note ? <p className="text-sm font-medium">{note}</p> : null}
      <OrderPanel v={v} />
      <ReservationActions id={v.id} side="supplier" actions={v.actions} canPay={false} cancelNote="Everything the buyer paid goes back to them in full." posted={v.order?.fulfilment === "post"} />
      <Link href={`/requests#r-${v.id}`} className="self-start text-sm text-moss-700 underline underline-offset-4">
        Messages and history<span className="sr-only"> for {v.gardener.name}&apos;s order</span>
      </Link>
    </article>
  );
}
