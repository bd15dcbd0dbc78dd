import { expireListings as markExpired } from "@/db/listings";
import { resolveContext, type Context } from "@/lib/context";

/** Worker job: listings whose end date has passed stop being on offer. */
export async function expireListings(ctx: Context = {}): Promise<number> {
  const { db: q, clock } = resolveContext(ctx);
  return markExpired(clock().toISOString(), q);
}
