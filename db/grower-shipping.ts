import { db, nowIso, type Db } from "./index";
import type { GrowerShippingRow, ListingQuality } from "./types";
import { toListingRow } from "./listings";

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
  pack_size: number | null;
  pack_price_cents: number | null;
  currency: string;
  quality: ListingQuality;
}

/** A grower's live-culture listings (material worms, sold by kg). */
export async function wormListingsOf(ownerId: string, q: Db = db()): Promise<WormListingRow[]> {
  const rows = (await q("listings")
    .select("id", "title", "status", "unit", "quantity_total", "quantity_held", "quantity_collected", "price_cents", "pack_size", "pack_price_cents", "currency", "quality")
    .where({ owner_id: ownerId, material_code: "worms" })
    .orderBy("updated_at", "desc")) as Record<string, unknown>[];
  return rows.map((r) => toListingRow<WormListingRow>(r));
}

/** Writes the listing's quality declarations (JSON), for its owner only; 0 when not theirs. */
export async function updateWormQuality(listingId: string, ownerId: string, quality: Record<string, unknown>, q: Db = db()): Promise<number> {
  return q("listings").where({ id: listingId, owner_id: ownerId, material_code: "worms" }).update({ quality: JSON.stringify(quality), updated_at: nowIso() });
}

/**
 * A grower's posted orders still waiting to go out: confirmed and paid or packed, or still
 * held with the money in (paid, or a deposit authorised) while the grower decides. A shipped
 * parcel is past a pause; a hold still awaiting payment has committed nothing yet.
 */
export async function waitingPostedOrderIds(ownerId: string, q: Db = db()): Promise<string[]> {
  const rows: { id: string }[] = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .select("r.id")
    .where({ "l.owner_id": ownerId, "r.fulfilment": "post" })
    .andWhere((w) =>
      w
        .where((c) => c.where("r.status", "confirmed").whereIn("r.order_stage", ["paid", "packed"]))
        .orWhere((c) => c.where("r.status", "held").whereIn("r.payment_state", ["paid", "authorised"])),
    )
    .orderBy("r.created_at");
  return rows.map((r) => r.id);
}
