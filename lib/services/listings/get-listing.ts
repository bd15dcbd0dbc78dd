import "server-only";
import { db } from "@/db/index";
import { findListing, findManagedListing } from "@/db/listings";
import { notFound } from "@/lib/api/errors";
import { PUBLIC_STATUSES } from "@/lib/listings/status";
import { presentDetail, type ListingDetail, type ManagedListingDetail } from "@/lib/listings/view";

/**
 * A listing as `viewerId` may see it: with the exact pickup point and address when they
 * manage it, without otherwise. Drafts, archived and hidden listings are 404 to the public.
 */
export async function getListing(id: string, viewerId: string | null, now: Date = new Date()): Promise<ListingDetail | ManagedListingDetail> {
  const managed = viewerId ? await findManagedListing(id, viewerId) : undefined;
  if (managed) return presentDetail(managed, { manage: true, now });
  const row = await findListing(id);
  if (!row || !PUBLIC_STATUSES.includes(row.status)) throw notFound("That listing");
  return presentDetail(row, { manage: false, now }, db());
}
