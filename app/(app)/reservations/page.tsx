import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { listReservations } from "@/lib/services/reservations/list-reservations";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { ArrivalNotice } from "@/components/reservations/arrival-notice";
import { ReservationCard } from "@/components/reservations/reservation-card";
import { viewerUnits } from "@/lib/units/viewer";
import type { ReservationView } from "@/lib/reservations/view";

export const metadata: Metadata = { title: "My reservations" };

/** Finished reservations shown per page; the ones coming up are always all shown. */
const EARLIER_PER_PAGE = 10;

const COMING: { id: string; title: string; has: (v: ReservationView) => boolean }[] = [
  { id: "to-pay", title: "To pay", has: (v) => v.can_pay },
  { id: "waiting", title: "Waiting for an answer", has: (v) => v.status === "held" && !v.can_pay },
  { id: "confirmed", title: "Confirmed", has: (v) => v.status === "confirmed" },
];

export default async function MyReservationsPage({ searchParams }: { searchParams: Promise<{ checkout?: string; new?: string; page?: string }> }) {
  const user = await pageUser("/reservations", ["gardener"]);
  const system = await viewerUnits(user);
  const { checkout, new: created, page: rawPage } = await searchParams;
  const views = await listReservations(user.id, "gardener");
  const current = views.filter((v) => v.status === "held" || v.status === "confirmed");
  const earlier = views.filter((v) => !(v.status === "held" || v.status === "confirmed"));
  const pages = Math.max(1, Math.ceil(earlier.length / EARLIER_PER_PAGE));
  const page = Math.min(pages, Math.max(1, Math.floor(Number(rawPage)) || 1));
  const earlierShown = earlier.slice((page - 1) * EARLIER_PER_PAGE, page * EARLIER_PER_PAGE);
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
            {current.length === 0 ? <p className="text-humus-700">Nothing on hold or waiting to be collected.</p> : null}
            {COMING.map((g) => {
              const items = current.filter(g.has);
              return items.length ? (
                <section key={g.id} aria-labelledby={`${g.id}-title`} className="flex flex-col gap-3">
                  <h3 id={`${g.id}-title`} className="text-lg font-semibold">
                    {g.title} ({items.length})
                  </h3>
                  {items.map((v) => (
                    <ReservationCard key={v.id} v={v} system={system} />
                  ))}
                </section>
              ) : null;
            })}
          </section>
          {earlier.length > 0 ? (
            <section aria-labelledby="earlier-title" className="flex flex-col gap-4">
              <h2 id="earlier-title" className="text-xl font-bold">
                Earlier ({earlier.length})
              </h2>
              {earlierShown.map((v) => (
                <ReservationCard key={v.id} v={v} system={system} />
              ))}
              {pages > 1 ? (
                <nav aria-label="Earlier reservations, by page" className="flex flex-wrap items-center gap-3">
                  {page > 1 ? (
                    <Link className={buttonClass("secondary")} href={`/reservations?page=${page - 1}#earlier-title`}>
                      Newer
                    </Link>
                  ) : null}
                  <span className="text-sm text-humus-700">
                    Page {page} of {pages}
                  </span>
                  {page < pages ? (
                    <Link className={buttonClass("secondary")} href={`/reservations?page=${page + 1}#earlier-title`}>
                      Older
                    </Link>
                  ) : null}
                </nav>
              ) : null}
            </section>
          ) : null}
        </div>
      )}
    </div>
  );
}
