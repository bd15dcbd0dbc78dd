import { formatMoney } from "@/lib/format/money";
import type { Metadata } from "next";
import type { ReactNode } from "react";
import Link from "next/link";
import { notFound } from "next/navigation";
import { cache } from "react";
import { currentUser, hasRole } from "@/lib/auth/current-user";
import { ApiError } from "@/lib/api/errors";
import { getListing } from "@/lib/services/listings/get-listing";
import type { ManagedListingDetail } from "@/lib/listings/view";
import { describeUnitSize, formatDay, formatListingQuantity, formatWindow, materialName } from "@/lib/listings/format";
import { APPROX_MAX_M } from "@/lib/geo/approximate";
import { buttonClass } from "@/components/ui/button-class";
import { Notice } from "@/components/ui/notice";
import { DuffMap } from "@/components/map/map";
import { MaterialArt } from "@/components/listings/material-art";
import { StatusActions } from "@/components/listings/status-actions";
import { StatusBadge } from "@/components/listings/status-badge";
import { TrustMarks } from "@/components/listings/trust-marks";
import { QualityList } from "@/components/listings/quality-list";
import { ListingCautions } from "@/components/listings/listing-cautions";
import { CultureFacts } from "@/components/grower/culture-facts";
import { cultureOffer } from "@/lib/services/growers/get-culture-offer";
import { viewerUnits } from "@/lib/units/viewer";
import { formatQuantity } from "@/lib/format/quantity";
import { listingCautions, type ListingCautionInput } from "@/lib/calc/cautions";
import type { MaterialCode } from "@/lib/calc/facts";
import { formatListingPrice, packCount, wholePacks } from "@/lib/listings/packs";

// One read per request for both the title and the page.
const load = cache(async (id: string) => {
  const viewer = await currentUser();
  try {
    return { viewer, listing: await getListing(id, viewer?.id ?? null) };
  } catch (err) {
    if (err instanceof ApiError && err.code === "not_found") return null;
    throw err;
  }
});

export async function generateMetadata({ params }: { params: Promise<{ id: string }> }): Promise<Metadata> {
  const found = await load((await params).id);
  return { title: found ? found.listing.title : "Listing not found" };
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm text-humus-600">{label}</dt>
      <dd className="font-medium">{children}</dd>
    </div>
  );
}

export default async function ListingPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const found = await load(id);
  if (!found) notFound();
  const { viewer, listing } = found;
  const system = await viewerUnits(viewer);
  const managed = "can_manage" in listing ? (listing as ManagedListingDetail) : null;
  const size = describeUnitSize(listing.unit, listing.unit_size, listing.unit_mass_kg, system, listing.material);
  const [cover, ...more] = listing.photos;
  // Live cultures: species, rough count, collection or post, and the grower's posting days or pause.
  const culture = await cultureOffer({ material: listing.material, owner_id: listing.supplier.id, quality: listing.quality as Record<string, unknown>, available: listing.quantity_available });

  return (
    <article className="flex flex-col gap-6">
      <Link href="/browse" className="text-sm text-moss-700 underline">
        ← All listings
      </Link>
      <header className="flex flex-col gap-2">
        <p className="text-sm font-semibold uppercase tracking-wide text-moss-700">{materialName(listing.material)}</p>
        <h1 className="text-3xl font-bold tracking-tight">{listing.title}</h1>
        <div className="flex flex-wrap items-center gap-2 text-humus-700">
          {listing.status !== "active" ? <StatusBadge status={listing.status} /> : null}
          <span>
            from <span className="font-medium">{listing.supplier.name}</span>
          </span>
          <TrustMarks supplier={listing.supplier} />
          {!managed && viewer?.id !== listing.supplier.id ? (
            // The form asks a visitor to sign in first, then comes back here.
            <Link href={`/report?user=${encodeURIComponent(listing.supplier.id)}`} className="text-sm text-humus-700 underline underline-offset-4">
              Report this supplier
            </Link>
          ) : null}
        </div>
      </header>

      <div className="grid gap-6 md:grid-cols-[minmax(0,1.3fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <figure className="overflow-hidden rounded-leaf bg-humus-100 ring-1 ring-humus-200">
            {cover ? (
              // eslint-disable-next-line @next/next/no-img-element
              <img src={cover.url} width={cover.width} height={cover.height} alt={`Photo 1 of ${listing.photos.length}: ${listing.title}`} className="h-auto w-full" />
            ) : (
              <MaterialArt material={listing.material} className="aspect-[4/3] w-full" />
            )}
          </figure>
          {more.length ? (
            <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="More photos">
              {more.map((p, i) => (
                <li key={p.url}>
                  {/* eslint-disable-next-line @next/next/no-img-element */}
                  <img src={p.url} width={p.width} height={p.height} alt={`Photo ${i + 2} of ${listing.photos.length}: ${listing.title}`} loading="lazy" className="h-auto w-full rounded ring-1 ring-humus-200" />
                </li>
              ))}
            </ul>
          ) : null}
          {listing.description ? <p className="whitespace-pre-line text-humus-800">{listing.description}</p> : null}
          <ListingCautions
            cautions={listingCautions({ material: listing.material as MaterialCode, unit: listing.unit, unit_mass_kg: listing.unit_mass_kg, quality: listing.quality as ListingCautionInput["quality"] }, system)}
            title={culture ? "Before you order" : "Before you collect"}
          />
        </div>

        <aside className="flex flex-col gap-4">
          <dl className="grid grid-cols-2 gap-4 rounded-lg bg-white p-4 ring-1 ring-humus-200">
            <Fact label="Left">
              {formatListingQuantity(listing.quantity_available, listing.unit, system)}
              {listing.pack ? <span className="block text-sm font-normal text-humus-600">{packCount(wholePacks(listing.quantity_available, listing.pack))}</span> : null}
              {size ? <span className="block text-sm font-normal text-humus-600">{size}</span> : null}
            </Fact>
            <Fact label="Price">{formatListingPrice(listing, system)}</Fact>
            <Fact label="No-show deposit">{listing.deposit_cents > 0 ? `${formatMoney(listing.deposit_cents, listing.currency)}, refunded on pickup` : "None"}</Fact>
            {listing.max_per_reservation ? (
              <Fact label="Most per person">
                {listing.pack ? `${packCount(wholePacks(listing.max_per_reservation, listing.pack))} (${formatListingQuantity(listing.max_per_reservation, listing.unit, system)})` : formatListingQuantity(listing.max_per_reservation, listing.unit, system)}
              </Fact>
            ) : null}
            {listing.available_from ? <Fact label="Available from">{formatDay(listing.available_from)}</Fact> : null}
            {listing.available_until ? <Fact label="Available until">{formatDay(listing.available_until)}</Fact> : null}
          </dl>

          {culture ? <CultureFacts culture={culture} /> : null}

          {culture && !culture.pickup ? null : (
            <section aria-labelledby="windows-title" className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
              <h2 id="windows-title" className="font-semibold">Pickup times</h2>
              {listing.pickup_windows.length ? (
                <ul className="mt-1 list-disc pl-5">
                  {listing.pickup_windows.map((w) => (
                    <li key={w.id}>{formatWindow(w)}</li>
                  ))}
                </ul>
              ) : (
                <p className="text-humus-700">Arrange a time when you reserve.</p>
              )}
            </section>
          )}

          {/* The culture block already names the species. */}
          <QualityList material={listing.material} quality={listing.quality} omit={culture ? ["species"] : []} />

          <section aria-labelledby="where-title" className="flex flex-col gap-2">
            <h2 id="where-title" className="font-semibold">Roughly where</h2>
            <DuffMap center={listing.location} zoom={13} markers={[{ id: listing.id, ...listing.location, label: "Approximate pickup area" }]} label="Map of the approximate pickup area" className="h-56" />
            <p className="text-sm text-humus-600">
              The point is within about {formatQuantity(APPROX_MAX_M, "m", system)} of the pickup. The exact address is shared once the supplier confirms your reservation.
            </p>
          </section>

          {managed ? (
            <section aria-labelledby="owner-title" className="flex flex-col gap-3 rounded-lg bg-moss-50 p-4 ring-1 ring-moss-300">
              <h2 id="owner-title" className="font-semibold">Only you see this</h2>
              <p>
                Pickup address: <span className="font-medium">{managed.pickup.address}</span>
                <span className="block text-sm text-humus-600">
                  Exact point {managed.pickup.location.lat.toFixed(5)}, {managed.pickup.location.lng.toFixed(5)} · {formatListingQuantity(managed.quantity_held, listing.unit, system)} on hold ·{" "}
                  {formatListingQuantity(managed.quantity_collected, listing.unit, system)} collected
                </span>
              </p>
              <p data-matched-needs={managed.matched_gardeners}>
                {managed.matched_gardeners === 0
                  ? "No gardener nearby has an open need for this yet."
                  : `You have been matched to ${managed.matched_gardeners} ${managed.matched_gardeners === 1 ? "gardener's need" : "gardeners' needs"}: each of them has been told about this listing.`}
              </p>
              <div className="flex flex-wrap items-center gap-3">
                <Link href={`/listings/${listing.id}/edit`} className={buttonClass("primary")}>
                  Edit
                </Link>
                <StatusActions id={listing.id} status={listing.status} title={listing.title} />
              </div>
            </section>
          ) : listing.status === "active" && listing.reservable_from ? (
            // Listed ahead of its start: reserving opens that day (the API refuses it before).
            <Notice>Reservations open on {formatDay(listing.reservable_from)}.</Notice>
          ) : listing.status === "active" && hasRole(viewer, "gardener") ? (
            <ReachableAction>
              <Link href={`/listings/${listing.id}/reserve`} className={buttonClass("primary", "w-full md:w-auto")}>
                Reserve
              </Link>
            </ReachableAction>
          ) : listing.status === "active" && !viewer ? (
            <ReachableAction>
              <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/listings/${listing.id}`)}`} className={buttonClass("secondary", "w-full md:w-auto")}>
                Sign in to reserve
              </Link>
            </ReachableAction>
          ) : listing.status !== "active" ? (
            <Notice>This listing is not taking reservations right now.</Notice>
          ) : null}
          {viewer && !managed ? (
            <Link href={`/report?listing=${listing.id}`} className="self-start text-sm text-humus-700 underline underline-offset-4">
              Report a problem with this listing
            </Link>
          ) : null}
        </aside>
      </div>
    </article>
  );
}

/** On a phone the reserve action stays at the foot of the screen however far down one reads; beside the facts on a wider one. */
function ReachableAction({ children }: { children: ReactNode }) {
  return (
    <>
      <div data-reserve-bar className="max-md:fixed max-md:inset-x-0 max-md:bottom-0 max-md:z-[1050] max-md:border-t max-md:border-humus-200 max-md:bg-humus-50 max-md:p-3 max-md:shadow-lg">
        {children}
      </div>
      <div aria-hidden="true" className="h-16 md:hidden" />
    </>
  );
}
