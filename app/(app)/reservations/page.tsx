import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listReservations } from "@/lib/services/list-reservations";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { ReservationCard } from "@/components/reservations/reservation-card";
import type { ReservationView } from "@/lib/reservations/view";

export const metadata: Metadata = { title: "My reservations" };

/** What the page says on arrival from reserving, as things stand for that reservation. */
function createdNotice(v: ReservationView | undefined) {
  if (!v) return null;
  if (v.payment.checkout === "not_opened") return <Notice tone="caution" title="Held — payment not opened yet">{v.payment.notice}</Notice>;
  if (v.can_pay) return <Notice title="Held for you">Pay from the reservation below to complete it; the supplier hears about it once the payment is through.</Notice>;
  if (v.status === "confirmed") return <Notice title="Reserved and accepted">The listing accepts at once: the address and your pickup code are below and on their way by e-mail.</Notice>;
  return <Notice title="Reserved">We have told the supplier. You will get an e-mail at each step.</Notice>;
}

export default async function MyReservationsPage({ searchParams }: { searchParams: Promise<{ checkout?: string; new?: string }> }) {
  const user = await pageUser("/reservations", ["gardener"]);
  const { checkout, new: created } = await searchParams;
  const views = await listReservations(user.id, "gardener");
  const current = views.filter((v) => v.status === "held" || v.status === "confirmed");
  const earlier = views.filter((v) => !(v.status === "held" || v.status === "confirmed"));
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="My reservations" lead="What you are collecting, when and where, your pickup codes, and your messages with the people giving it." />
      <div className="mb-6 flex flex-col gap-3 empty:hidden">
        {checkout === "cancelled" ? (
          <Notice title="You left the payment page">Nothing was charged. The hold stays for now: pay from the reservation below, or cancel it so the material goes back.</Notice>
        ) : null}
        {createdNotice(views.find((v) => v.id === created))}
      </div>
      {views.length === 0 ? (
        <EmptyState title="No reservations yet" action={<Link className={buttonClass()} href="/beds">Find material for a bed</Link>}>
          When you reserve leaves, straw, cardboard or worms, they appear here with the pickup details.
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-8">
          <section aria-labelledby="current-title" className="flex flex-col gap-4">
            <h2 id="current-title" className="text-xl font-bold">
              Coming up ({current.length})
            </h2>
            {current.length === 0 ? <p className="text-humus-700">Nothing on hold or waiting to be collected.</p> : current.map((v) => <ReservationCard key={v.id} v={v} />)}
          </section>
          {earlier.length > 0 ? (
            <section aria-labelledby="earlier-title" className="flex flex-col gap-4">
              <h2 id="earlier-title" className="text-xl font-bold">
                Earlier ({earlier.length})
              </h2>
              {earlier.map((v) => (
                <ReservationCard key={v.id} v={v} />
              ))}
            </section>
          ) : null}
        </div>
      )}
    </div>
  );
}
