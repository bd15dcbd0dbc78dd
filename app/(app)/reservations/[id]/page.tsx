import Link from "next/link";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { ApiError } from "@/lib/api/errors";
import { getReservation } from "@/lib/services/reservations/get-reservation";
import { whatLabel } from "@/lib/reservations/labels";
import { PageHeading } from "@/components/ui/empty-state";
import { ReservationCard } from "@/components/reservations/reservation-card";
import { ArrivalNotice } from "@/components/reservations/arrival-notice";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Reservation" };

// One reservation, for either side of it: where every e-mail about it links, so the link
// still finds it however long the lists grow. Anyone else gets the 404 page.
export default async function ReservationPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ checkout?: string; new?: string }> }) {
  const { id } = await params;
  const { checkout, new: created } = await searchParams;
  const user = await pageUser(`/reservations/${encodeURIComponent(id)}`);
  const system = await viewerUnits(user);
  const v = await getReservation(id, user.id).catch((err) => {
    if (err instanceof ApiError && err.code === "not_found") notFound();
    throw err;
  });
  const back = v.side === "gardener" ? { href: "/reservations", label: "All my reservations" } : { href: "/requests", label: "All requests" };
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={back.href} className="text-moss-700 underline underline-offset-2">
          {back.label}
        </Link>
      </nav>
      <PageHeading title={v.side === "gardener" ? "Your reservation" : `Request from ${v.gardener.name}`} lead={whatLabel({ quantity: v.quantity, listing: v.listing }, system)} />
      <div className="flex flex-col gap-3 empty:hidden">
        {v.side === "gardener" ? <ArrivalNotice v={v} created={created === "1"} cancelled={checkout === "cancelled"} /> : null}
      </div>
      <ReservationCard v={v} system={system} />
    </div>
  );
}
