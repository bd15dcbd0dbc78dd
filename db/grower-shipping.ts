import { db, nowIso, type Db } from "./index";
import type { GrowerShippingRow } from "./types";

export async function findShipping(userId: string, q: Db = db()): Promise<GrowerShippingRow | undefined> {
  return (await q("grower_shipping").first("user_id", "ship_weekdays", "paused", "pause_reason", "pause_note", "updated_at").where({ user_id: userId })) as
    | GrowerShippingRow
    | undefined;
}

export async function saveShipping(row: Omit<GrowerShippingRow, "updated_at">, q: Db = db()): Promise<void> {
  const full = { ...row, updated_at: nowIso() };
  await q("grower_shipping").insert(full).onConflict("user_id").merge();
}

export interface WormListingRow {
  id: string;
  title: string;
  status: string;
  unit: string;
  quantity_total: number;
  quantity_held: number;
  quantity_collected: number;
  price_cents: number;
  currency: string;
  quality: string;
}

/** A grower's live-culture listings (material worms, sold by kg). */
export async function wormListingsOf(ownerId: string, q: Db = db()): Promise<WormListingRow[]> {
  return q("listings")
    .select("id", "title", "status", "unit", "quantity_total", "quantity_held", "quantity_collected", "price_cents", "currency", "quality")
    .where({ owner_id: ownerId, material_code: "worms" })
    .orderBy("updated_at", "desc");
}

/** Writes the listing's quality declarations (JSON), for its owner only; 0 when not theirs. */
export async function updateWormQuality(listingId: string, ownerId: string, quality: Record<string, unknown>, q: Db = db()): Promise<number> {
  return q("listings").where({ id: listingId, owner_id: ownerId, material_code: "worms" }).update({ quality: JSON.stringify(quality), updated_at: nowIso() });
}
