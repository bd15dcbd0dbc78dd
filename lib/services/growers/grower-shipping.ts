import "server-only";
import { db, type Db } from "@/db/index";
import { lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { findShipping, saveShipping, updateWormQuality, waitingPostedOrderIds, wormListingsOf } from "@/db/grower-shipping";
import { reservationContexts } from "@/db/reservation-context";
import { mailCultureOrder } from "@/lib/mail/culture-order-mail";
import { recordAudit } from "@/db/audit";
import { notFound } from "@/lib/api/errors";
import { estimatedWorms } from "@/lib/reservations/culture-orders";
import { type CultureInput, type ShippingInput } from "@/lib/validation/grower";
import { shippingView, type ShippingView } from "@/lib/growers/view";
import { packOf, type Pack } from "@/lib/listings/packs";
import { parseQuality } from "@/lib/listings/quality";

export async function growerShipping(userId: string): Promise<ShippingView> {
  return shippingView(await findShipping(userId));
}

export async function saveGrowerShipping(userId: string, input: ShippingInput): Promise<ShippingView> {
  return writeTransaction(db(), async (trx) => {
    // One save at a time per grower (the row may not exist yet, so the person's own row is
    // held): two saves at once cannot both see "not paused" and both mail the pause.
    await lockRows(trx, "users", { id: userId });
    const before = await findShipping(userId, trx);
    const row = {
      user_id: userId,
      ship_weekdays: [...input.ship_weekdays].sort().join(","),
      paused: input.paused,
      pause_reason: input.paused ? input.pause_reason : null,
      pause_note: input.paused ? input.pause_note : null,
    };
    await saveShipping(row, trx);
    await recordAudit({ actor_id: userId, action: "grower.shipping", subject_type: "user", subject_id: userId, before: before ?? null, after: row }, trx);
    await tellWaitingBuyers(userId, !!before?.paused, input.paused, trx);
    return shippingView(row);
  });
}

/**
 * Buyers whose parcel waits are told when posting stops and when it starts again, in the
 * transaction that changes it. Only a change tells anyone: saving the same pause again (a
 * new note, another day ticked) mails nobody. The dedupe key names the pause or the resume
 * by the moment it was saved, so one pause writes at most one e-mail per order.
 */
async function tellWaitingBuyers(userId: string, wasPaused: boolean, paused: boolean, trx: Db): Promise<void> {
  if (wasPaused === paused) return;
  const ids = await waitingPostedOrderIds(userId, trx);
  if (ids.length === 0) return;
  const saved = await findShipping(userId, trx);
  const now = new Date();
  for (const r of await reservationContexts(ids, trx)) {
    await mailCultureOrder(trx, paused ? "posting_paused" : "posting_resumed", r, ["gardener"], now, saved?.updated_at ?? now.toISOString());
  }
}

export interface CultureStock {
  id: string;
  title: string;
  status: string;
  kg_left: number;
  kg_held: number;
  estimated_count: number;
  species: string | null;
  ships: boolean;
  pickup: boolean;
  price_cents: number;
  /** Sold by the pack: the pack's weight (kg) and price. */
  pack: Pack | null;
  currency: string;
}

/** The grower's worm listings with what is left and roughly how many worms that is. */
export async function cultureStock(userId: string): Promise<CultureStock[]> {
  return (await wormListingsOf(userId)).map((l) => {
    const quality = parseQuality(l.quality);
    const left = Math.max(0, l.quantity_total - l.quantity_held - l.quantity_collected);
    return {
      id: l.id,
      title: l.title,
      status: l.status,
      kg_left: left,
      kg_held: l.quantity_held,
      // About 1,000 worms per lb (common practice, no source), to the hundred.
      estimated_count: estimatedWorms(left),
      species: typeof quality.species === "string" && quality.species.trim() ? quality.species : null,
      ships: quality.ships !== false,
      pickup: quality.pickup !== false,
      price_cents: l.price_cents,
      pack: packOf(l),
      currency: l.currency,
    };
  });
}

export async function saveCulture(userId: string, listingId: string, input: CultureInput) {
  return writeTransaction(db(), async (trx) => {
    await lockRows(trx, "listings", { id: listingId, owner_id: userId }); // merged into its quality JSON below
    const listing = (await wormListingsOf(userId, trx)).find((l) => l.id === listingId);
    if (!listing) throw notFound("That worm listing");
    const before = parseQuality(listing.quality);
    const after = { ...before, species: input.species, ships: input.ships, pickup: input.pickup };
    await updateWormQuality(listingId, userId, after, trx);
    await recordAudit({ actor_id: userId, action: "grower.culture", subject_type: "listing", subject_id: listingId, before, after }, trx);
    return { id: listingId, ...input };
  });
}
