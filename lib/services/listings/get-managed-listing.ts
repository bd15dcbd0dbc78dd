import { findManagedListing } from "@/db/listings";
import type { ListingRow } from "@/db/types";
import { resolveContext, type Context } from "@/lib/context";

/** A listing the user may change (their own, or their council's); otherwise not found. */
export async function getManagedListing(id: string, userId: string, ctx: Context = {}): Promise<ListingRow | undefined> {
  return findManagedListing(id, userId, resolveContext(ctx).db);
}
