import type { Metadata } from "next";
import Link from "next/link";
import { pageUser } from "@/lib/auth/page-guard";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { listManagedListings } from "@/lib/services/listings/list-managed-listings";
import { effectiveStatus, quantityLeft } from "@/lib/listings/status";
import { buttonClass } from "@/components/ui/button-class";
import { EmptyState, PageHeading } from "@/components/ui/empty-state";
import { MineTable, type MineRow } from "@/components/listings/mine-table";
import { viewerUnits } from "@/lib/units/viewer";

export const metadata: Metadata = { title: "What I'm giving" };

export default async function MyListingsPage() {
  const user = await pageUser("/listings/mine", LISTING_ROLES);
  const now = new Date();
  const rows: MineRow[] = (await listManagedListings(user.id)).map((l) => ({
    id: l.id,
    title: l.title,
    material: l.material_code,
    status: effectiveStatus(l.status, l.available_until, now),
    unit: l.unit,
    left: quantityLeft(l),
    total: l.quantity_total,
    held: l.quantity_held,
    updated_at: l.updated_at,
  }));
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeading
          title="What I'm giving"
          lead={user.organisation ? `Your listings and ${user.organisation.name}'s: how much is left, what is on hold.` : "Your listings, how much is left, and what is on hold."}
        />
        <Link href="/listings/new" className={buttonClass("primary")}>
          Post a listing
        </Link>
      </div>
      {rows.length === 0 ? (
        <EmptyState
          title="Nothing listed yet"
          action={
            <Link href="/listings/new" className={buttonClass("primary")}>
              Post your first listing
            </Link>
          }
        >
          When you post spare leaves, boxes or bales, they appear here with how much is left.
        </EmptyState>
      ) : (
        <MineTable rows={rows} system={await viewerUnits(user)} />
      )}
    </div>
  );
}
