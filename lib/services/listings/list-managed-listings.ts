import { listingsManagedBy } from "@/db/listings";
import type { ListingRow } from "@/db/types";
import { resolveContext, type Context } from "@/lib/context";

/** Every listing the user may change: their own and their council's. */
export async function listManagedListings(userId: string, ctx: Context = {}): Promise<ListingRow[]> {
  return listingsManagedBy(userId, resolveContext(ctx).db);
}
