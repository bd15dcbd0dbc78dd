import { formatMoney } from "@/lib/format/money";
import Link from "next/link";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { loadAlertPage } from "@/lib/services/needs/load-alert-page";
import { MATERIALS } from "@/lib/calc/facts";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun } from "@/lib/match/format";
import { formatListingQuantity , formatDay } from "@/lib/listings/format";
import { formatNeedQuantity } from "@/lib/needs/units";
import { longDate } from "@/lib/time/zoned";
import { PageHeading, EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button-class";
import { ConfirmEmailNotice } from "@/components/profile/account-security";
import { ReserveFromAlert } from "@/components/needs/reserve-from-alert";
import { ListingCautions } from "@/components/listings/listing-cautions";
import { formatListingPrice } from "@/lib/listings/packs";

export const metadata: Metadata = { title: "Found for your need" };
export const dynamic = "force-dynamic";

export default async function AlertPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/needs/alerts/${id}`, ["gardener"]);
  const page = await loadAlertPage(user.id, id);
  if (!page) notFound();
  const { alert, need, offer, cautions, amount } = page;
  const l = alert.listing;
  const system = user.unit_system;
  const forWhat = need.bed ? `for ${need.bed.name}` : "";
  const back = (
    <Link href="/needs" className={buttonClass("secondary")}>
      Back to my needs
    </Link>
  );
  const reservable = offer && offer.status === "active" && !offer.reservable_from && offer.available > 0;

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeading
        title={l.title}
        lead={
          <>
            {MATERIALS[l.material].name} from {l.supplier}, about {formatQuantity(Math.max(0.1, l.distance_km), "km", system)} from {need.bed ? need.bed.name : "your place"}. Found for your need of{" "}
            {formatNeedQuantity(need.quantity, need.unit, need.material, system)} {forWhat} by {longDate(need.needed_by)}.
          </>
        }
      />

      <dl className="grid grid-cols-2 gap-4 rounded-lg bg-white p-4 ring-1 ring-humus-200 sm:grid-cols-4">
        <div>
          <dt className="text-sm text-humus-600">Left</dt>
          <dd className="font-medium">{formatListingQuantity(l.quantity_available, l.unit, system)}</dd>
        </div>
        <div>
          <dt className="text-sm text-humus-600">Price</dt>
          <dd className="font-medium">{formatListingPrice(l, system)}</dd>
        </div>
        <div>
          <dt className="text-sm text-humus-600">Deposit</dt>
          <dd className="font-medium">{l.deposit_cents > 0 ? `${formatMoney(l.deposit_cents, l.currency)}, refunded on pickup` : "None"}</dd>
        </div>
        <div>
          <dt className="text-sm text-humus-600">Your need still lacks</dt>
          <dd className="font-medium">{formatNeedQuantity(need.quantity_left, need.unit, need.material, system)}</dd>
        </div>
      </dl>

      <ListingCautions cautions={cautions} />

      {need.status !== "open" ? (
        <EmptyState title={`This need is ${need.status === "met" ? "met" : need.status === "expired" ? "past its date" : "closed"}`} action={back}>
          Open it again on your needs page if you still want {materialNoun(need.material)}.
        </EmptyState>
      ) : !offer ? (
        <EmptyState title="This listing is no longer on Duffbank" action={back} />
      ) : !user.email_verified ? (
        <ConfirmEmailNotice email={user.email} />
      ) : offer.status === "active" && offer.reservable_from ? (
        <EmptyState title="Not taking reservations yet" action={back}>
          It can be reserved from {formatDay(offer.reservable_from)}; come back to this page then.
        </EmptyState>
      ) : !reservable ? (
        <EmptyState title="All of it is spoken for, or it is not on offer now" action={back}>
          Holds that are not paid or accepted in time run out, so check back later. Your need stays open.
        </EmptyState>
      ) : amount <= 0 ? (
        <EmptyState title="Nothing to reserve" action={back}>
          Reservations you already hold cover this need.
        </EmptyState>
      ) : (
        <section aria-labelledby="reserve-title" className="flex flex-col gap-3 rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <h2 id="reserve-title" className="text-lg font-semibold">
            Reserve what your need lacks
          </h2>
          <ReserveFromAlert
            listingId={l.id}
            needId={need.id}
            bedId={need.bed?.id ?? null}
            bedName={need.bed?.name ?? null}
            amount={amount}
            unit={offer.unit}
            priceCents={offer.price_cents}
            pack={offer.pack}
            depositCents={offer.deposit_cents}
            currency={offer.currency}
            window={offer.windows[0] ?? null}
          />
          <p className="text-sm">
            <Link href={`/listings/${l.id}/reserve`} className="text-moss-700 underline underline-offset-4">
              Choose another amount or pickup time
            </Link>{" "}
            ·{" "}
            <Link href={`/listings/${l.id}`} className="text-moss-700 underline underline-offset-4">
              See the whole listing
            </Link>
          </p>
        </section>
      )}
    </div>
  );
}
