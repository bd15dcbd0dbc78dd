import { db, type Db } from "./index";

// The few listing reads and writes moderation and the home page need. The listings feature
// owns the rest of the table; browse and match share its rule that only status 'active'
// is public, which is what makes a hidden listing vanish everywhere at once.

export interface ListingBrief {
  id: string;
  title: string;
  status: string;
  owner_id: string;
  organisation_id: string | null;
  material_code: string;
  owner_name: string;
  owner_email: string;
}

export const PUBLIC_LISTING_STATUS = "active";

export async function findListingBrief(id: string, q: Db = db()): Promise<ListingBrief | undefined> {
  return q("listings as l")
    .join("users as u", "u.id", "l.owner_id")
    .first("l.id", "l.title", "l.status", "l.owner_id", "l.organisation_id", "l.material_code", "u.display_name as owner_name", "u.email as owner_email")
    .where("l.id", id);
}

/** A listing as the public may see it: active, or not at all. */
export async function findVisibleListing(id: string, q: Db = db()): Promise<ListingBrief | undefined> {
  const l = await findListingBrief(id, q);
  return l && l.status === PUBLIC_LISTING_STATUS ? l : undefined;
}

/** How many listings anyone can browse right now: active with something left. */
export async function countVisibleListings(q: Db = db()): Promise<number> {
  const [{ n }] = await q("listings")
    .where("status", PUBLIC_LISTING_STATUS)
    .andWhereRaw("quantity_total - quantity_held - quantity_collected > 0")
    .count({ n: "*" });
  return Number(n);
}
