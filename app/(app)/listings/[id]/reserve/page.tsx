import Link from "next/link";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { loadReserveOffer } from "@/lib/services/reservations/load-reserve-offer";
import { pickupCautions } from "@/lib/reservations/cautions";
import { quantityLabel } from "@/lib/reservations/labels";
import { formatDay } from "@/lib/listings/format";
import { PageHeading, EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { ReserveForm } from "@/components/reservations/reserve-form";
import { ConfirmEmailNotice } from "@/components/profile/account-security";
import { viewerUnits } from "@/lib/units/viewer";
import { TrustMarks } from "@/components/listings/trust-marks";

export const metadata: Metadata = { title: "Reserve" };

export default async function ReservePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/listings/${id}/reserve`, ["gardener"]);
  const system = await viewerUnits(user);
  const offer = await loadReserveOffer(id);
  if (!offer) notFound();
  const lead = (
    <>
      From {offer.supplier.name} <TrustMarks supplier={offer.supplier} className="ml-1" />
    </>
  );
  const back = (
    <Link href={`/listings/${offer.id}`} className={buttonClass("quiet")}>
      Back to the listing
    </Link>
  );
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeading title={`Reserve: ${offer.title}`} lead={lead} />
      {offer.owner_id === user.id ? (
        <Notice title="This is your own listing">There is nothing to reserve here; requests from gardeners appear under Requests.</Notice>
      ) : !user.email_verified ? (
        <ConfirmEmailNotice email={user.email} />
      ) : offer.status === "gone" || (offer.status === "active" && offer.available <= 0) ? (
        <EmptyState title="All of it is spoken for" action={back}>Holds that are not paid or accepted in time run out, so check back later.</EmptyState>
      ) : offer.status === "active" && offer.reservable_from ? (
        <EmptyState title="Not taking reservations yet" action={back}>It can be reserved from {formatDay(offer.reservable_from)}.</EmptyState>
      ) : offer.status !== "active" ? (
        <EmptyState title="Not taking reservations" action={back}>This listing is {offer.status} at the moment.</EmptyState>
      ) : offer.culture && !offer.culture.pickup && !offer.culture.can_post ? (
        // A posted-only culture while the grower has paused posting for heat or frost.
        <EmptyState title="Not posting right now" action={back}>
          {offer.culture.shipping.notice}
        </EmptyState>
      ) : (
        <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <p className="mb-4 text-sm text-humus-700">
            {quantityLabel(offer.available, offer.unit, system)} available
            {offer.culture ? `, about ${offer.culture.estimated_count.toLocaleString("en-GB")} worms${offer.culture.species ? ` of ${offer.culture.species}` : ""} (roughly 1,000 a pound)` : ""}.{" "}
            {offer.culture && !offer.culture.pickup ? null : `The exact pickup address is sent to you once ${offer.supplier.name} has accepted.`}
          </p>
          <ReserveForm
            offer={offer}
            unitSystem={system}
            cautions={pickupCautions({ material: offer.material, unit: offer.unit, unit_mass_kg: offer.unit_mass_kg }, system)}
            // A culture the grower posts: the handling advice is for a parcel, not a trip to collect.
            postedCautions={offer.culture?.ships ? pickupCautions({ material: offer.material, unit: offer.unit, unit_mass_kg: offer.unit_mass_kg, fulfilment: "post" }, system) : undefined}
          />
        </div>
      )}
    </div>
  );
}
