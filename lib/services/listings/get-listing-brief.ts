import { findListingBrief } from "@/db/listing-status";

/** A listing's title and owner, enough to name it (e.g. on the report form). */
export async function getListingBrief(id: string) {
  return findListingBrief(id);
}
