import "server-only";
import { findListing, findManagedListing } from "@/db/listings";
import { notFound } from "@/lib/api/errors";
import { PUBLIC_STATUSES } from "@/lib/listings/status";
import { presentDetail, type ListingDetail, type ManagedListingDetail } from "@/lib/listings/view";
import { resolveContext, type Context } from "@/lib/context";

/**
 * A listing as `viewerId` may see it: with the exact pickup point and address when they
 * manage it, without otherwise. Drafts, archived and hidden listings are 404 to the public.
 */
export async function getListing(id: string, viewerId: string | null, ctx: Context = {}): Promise<ListingDetail | ManagedListingDetail> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const managed = viewerId ? await findManagedListing(id, viewerId, q) : undefined;
  if (managed) return presentDetail(managed, { manage: true, now }, q);
  const row = await findListing(id, q);
  if (!row || !PUBLIC_STATUSES.includes(row.status)) throw notFound("That listing");
  return presentDetail(row, { manage: false, now }, q);
}
