import { findListingBrief } from "@/db/listing-status";
import { resolveContext, type Context } from "@/lib/context";

/** A listing's title and owner, enough to name it (e.g. on the report form). */
export async function getListingBrief(id: string, ctx: Context = {}) {
  return findListingBrief(id, resolveContext(ctx).db);
}
