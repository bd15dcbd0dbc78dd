import type { ReservationView } from "@/lib/reservations/view";
import { Notice } from "@/components/ui/notice";
import { formatLocal } from "@/lib/reservations/pickup-times";

/**
 * What a reservation page says on arrival: just reserved (`created`), or back from leaving
 * the payment page (`cancelled`), as things stand for that reservation.
 */
export function ArrivalNotice({ v, created, cancelled }: { v: ReservationView | undefined; created: boolean; cancelled: boolean }) {
  if (cancelled) {
    return <Notice title="You left the payment page">Nothing was charged. The hold stays for now: pay from the reservation below, or cancel it so the material goes back.</Notice>;
  }
  if (!v || !created) return null;
  if (v.payment.checkout === "not_opened") return <Notice tone="caution" title="Held — payment not opened yet">{v.payment.notice}</Notice>;
  if (v.can_pay) return <Notice title="Held for you">Pay from the reservation below to complete it; the supplier hears about it once the payment is through.</Notice>;
  if (v.status === "confirmed") return <Notice title="Reserved and accepted">The listing accepts at once: the address and your pickup code are below and on their way by e-mail.</Notice>;
  return (
    <Notice title="Reserved">
      We have told {v.supplier.name}: they have until {formatLocal(v.hold_expires_at!)} to accept, and you will get an e-mail at each step.
    </Notice>
  );
}
