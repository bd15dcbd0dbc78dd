import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { PageHeading } from "@/components/ui/empty-state";
import { ListingForm } from "@/components/listings/listing-form";
import { ConfirmEmailNotice } from "@/components/profile/account-security";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "Post a listing" };

export default async function NewListingPage() {
  const user = await pageUser("/listings/new", LISTING_ROLES);
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="Post a listing" lead="Say what you have spare and when it can be collected. Most listings take two minutes." />
      {user.email_verified ? (
        <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
          <ListingForm mode="create" unitSystem={await viewerUnits(user)} canSellWorms={user.roles.includes("grower")} />
        </div>
      ) : (
        <ConfirmEmailNotice email={user.email} />
      )}
    </div>
  );
}
