import { listingsManagedBy } from "@/db/listings";
import type { ListingRow } from "@/db/types";

/** Every listing the user may change: their own and their council's. */
export async function listManagedListings(userId: string): Promise<ListingRow[]> {
  return listingsManagedBy(userId);
}
