import "server-only";
import { availableOf, listingsForReservation, pickupWindowsOf } from "@/db/reservations";
import { collectionsFor, ratingsFor } from "@/db/reviews";
import { nextOccurrence, windowLabel } from "@/lib/reservations/pickup-times";
import { holdMinutes, holdWaitFor } from "@/lib/reservations/policy";
import { answerByFor, pickupChoices } from "@/lib/reservations/pickup-choices";
import { reservableQuantity } from "@/lib/reservations/labels";
import { packOf } from "@/lib/listings/packs";
import { datesState, effectiveStatus } from "@/lib/listings/status";
import { cultureOffer } from "@/lib/services/growers/get-culture-offer";
import { depositFor } from "@/lib/payments/money";
import { resolveContext, type Context } from "@/lib/context";

/** What the reserve page shows about a listing: public facts only, never the address. */
export async function loadReserveOffer(listingId: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const [l] = await listingsForReservation([listingId], q);
  if (!l || l.status === "draft" || l.status === "hidden") return null;
  const pack = packOf(l);
  const available = reservableQuantity(availableOf(l), l.unit, pack);
  const [windows, owner, ratings, culture, collections] = await Promise.all([
    pickupWindowsOf([l.id], q),
    q("users").first("display_name", "verified_at").where({ id: l.owner_id }),
    ratingsFor([l.owner_id], q),
    cultureOffer({ material: l.material_code, owner_id: l.owner_id, quality: l.quality, available }, { db: q, clock: () => now }),
    collectionsFor([l.owner_id], q),
  ]);
  const deposit = depositFor(l.price_cents, l.deposit_cents);
  const terms = { owes: l.price_cents > 0 || deposit > 0, autoAccept: Boolean(l.auto_accept) };
  return {
    id: l.id,
    title: l.title,
    material: l.material_code,
    // Past its end date it is expired even before the worker has written so.
    status: effectiveStatus(l.status, l.available_until, now),
    /** Listed ahead of its start date: reservable only from this moment. */
    reservable_from: datesState(l, now) === "not_yet" ? l.available_from : null,
    owner_id: l.owner_id,
    unit: l.unit,
    unit_size: l.unit_size,
    unit_mass_kg: l.unit_mass_kg,
    available,
    max_per_reservation: l.max_per_reservation,
    price_cents: l.price_cents,
    /** Sold by the pack: reserve whole packs of `pack.size` at `pack.price_cents` each. */
    pack,
    // Deposits apply to free listings only (lib/reservations/policy.ts).
    deposit_cents: deposit,
    currency: l.currency,
    auto_accept: Boolean(l.auto_accept),
    hold_minutes: holdMinutes(),
    /** What a new reservation would wait for: the gardener's checkout, the supplier's answer, or nothing. */
    waits_for: holdWaitFor(terms),
    /** With no fixed pickup time: when the supplier would have to answer by. */
    answer_by_no_window: answerByFor(now, terms, null),
    supplier: { name: owner?.display_name ?? "The supplier", verified: Boolean(owner?.verified_at), rating: ratings.get(l.owner_id) ?? null, collections: collections.get(l.owner_id) ?? 0 },
    /** Live cultures only: how it can reach the buyer, and the grower's posting days or pause. */
    culture,
    windows: pickupChoices(windows, now, terms),
  };
}

export type ReserveOffer = NonNullable<Awaited<ReturnType<typeof loadReserveOffer>>>;
