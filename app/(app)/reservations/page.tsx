import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listReservations } from "@/lib/services/list-reservations";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { ArrivalNotice } from "@/components/reservations/arrival-notice";
import { ReservationCard } from "@/components/reservations/reservation-card";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "My reservations" };

export default async function MyReservationsPage({ searchParams }: { searchParams: Promise<{ checkout?: string; new?: string }> }) {
  const user = await pageUser("/reservations", ["gardener"]);
  const system = await viewerUnits(user);
  const { checkout, new: created } = await searchParams;
  const views = await listReservations(user.id, "gardener");
  const current = views.filter((v) => v.status === "held" || v.status === "confirmed");
  const earlier = views.filter((v) => !(v.status === "held" || v.status === "confirmed"));
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="My reservations" lead="What you are collecting, when and where, your pickup codes, and your messages with the people giving it." />
      <div className="mb-6 flex flex-col gap-3 empty:hidden">
        <ArrivalNotice v={views.find((v) => v.id === created)} created={!!created} cancelled={checkout === "cancelled"} />
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
            {current.length === 0 ? <p className="text-humus-700">Nothing on hold or waiting to be collected.</p> : current.map((v) => <ReservationCard key={v.id} v={v} system={system} />)}
          </section>
          {earlier.length > 0 ? (
            <section aria-labelledby="earlier-title" className="flex flex-col gap-4">
              <h2 id="earlier-title" className="text-xl font-bold">
                Earlier ({earlier.length})
              </h2>
              {earlier.map((v) => (
                <ReservationCard key={v.id} v={v} system={system} />
              ))}
            </section>
          ) : null}
        </div>
      )}
    </div>
  );
}
