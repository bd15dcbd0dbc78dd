import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { pageUser } from "@/lib/auth/page-guard";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { getManagedListing } from "@/lib/services/listings/get-managed-listing";
import { getListing } from "@/lib/services/listings/get-listing";
import type { ManagedListingDetail } from "@/lib/listings/view";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { ListingForm } from "@/components/listings/listing-form";
import { fromListing } from "@/components/listings/form-values";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Edit listing" };

export default async function EditListingPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await pageUser(`/listings/${id}/edit`, LISTING_ROLES);
  const system = await viewerUnits(user);
  // Someone else's listing is a 404 here too, exactly as in the API.
  if (!(await getManagedListing(id, user.id))) notFound();
  const listing = (await getListing(id, user.id)) as ManagedListingDetail;
  const locked = listing.status === "archived" || listing.status === "hidden";
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title={`Edit “${listing.title}”`} lead={<Link href={`/listings/${id}`} className="text-moss-700 underline">See it as others do</Link>} />
      {locked ? (
        <Notice tone="caution" title="This listing cannot be edited">
          {listing.status === "archived" ? "It is archived. Post a new listing instead." : "A moderator has hidden it."}
        </Notice>
      ) : (
        <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <ListingForm
            mode="edit"
            listingId={id}
            unitSystem={system}
            canSellWorms={user.roles.includes("grower")}
            initial={fromListing({ ...listing, quality: listing.quality as Record<string, unknown> }, system)}
            photos={listing.photo_records.map((p) => ({ id: p.id, url: p.url }))}
          />
        </div>
      )}
    </div>
  );
}
