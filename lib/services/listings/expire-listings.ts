import { db } from "@/db/index";
import { expireListings as markExpired } from "@/db/listings";

/** Worker job: listings whose end date has passed stop being on offer. */
export async function expireListings(clock: () => Date = () => new Date()): Promise<number> {
  return markExpired(clock().toISOString(), db());
}
