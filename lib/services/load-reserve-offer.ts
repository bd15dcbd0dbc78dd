import "server-only";
import { db } from "@/db/index";
import { availableOf, listingsForReservation, pickupWindowsOf } from "@/db/reservations";
import { collectionsFor, ratingsFor } from "@/db/reviews";
import { nextOccurrence, windowLabel } from "@/lib/reservations/pickup-times";
import { holdMinutes } from "@/lib/reservations/policy";
import { WHOLE_UNITS } from "@/lib/reservations/labels";
import { datesState, effectiveStatus } from "@/lib/listings/status";
import { cultureOffer } from "./culture-offer";

function qualityOf(text: string): Record<string, unknown> {
  try {
    const v = JSON.parse(text);
    return v && typeof v === "object" ? v : {};
  } catch {
    return {};
  }
}

/** What the reserve page shows about a listing: public facts only, never the address. */
export async function loadReserveOffer(listingId: string, now = new Date()) {
  const [l] = await listingsForReservation([listingId]);
  if (!l || l.status === "draft" || l.status === "hidden") return null;
  // Nobody can take 0.7 of a bale, whatever the listing's total says.
  const available = WHOLE_UNITS.has(l.unit) ? Math.floor(availableOf(l) + 1e-9) : availableOf(l);
  const [windows, owner, ratings, culture, collections] = await Promise.all([
    pickupWindowsOf([l.id]),
    db()("users").first("display_name", "verified_at").where({ id: l.owner_id }),
    ratingsFor([l.owner_id]),
    cultureOffer({ material: l.material_code, owner_id: l.owner_id, quality: qualityOf(l.quality), available }, now),
    collectionsFor([l.owner_id]),
  ]);
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
    // Deposits apply to free listings only (lib/reservations/policy.ts).
    deposit_cents: l.price_cents > 0 ? 0 : l.deposit_cents,
    currency: l.currency,
    auto_accept: Boolean(l.auto_accept),
    hold_minutes: holdMinutes(),
    supplier: { name: owner?.display_name ?? "The supplier", verified: Boolean(owner?.verified_at), rating: ratings.get(l.owner_id) ?? null, collections: collections.get(l.owner_id) ?? 0 },
    /** Live cultures only: how it can reach the buyer, and the grower's posting days or pause. */
    culture,
    windows: windows
      .map((w) => ({ id: w.id, label: windowLabel(w), next: nextOccurrence(w, now) }))
      .filter((w) => w.next)
      .sort((a, b) => a.next!.start.getTime() - b.next!.start.getTime())
      .map((w) => ({ id: w.id, label: w.label, next_start: w.next!.start.toISOString(), next_end: w.next!.end.toISOString() })),
  };
}

export type ReserveOffer = NonNullable<Awaited<ReturnType<typeof loadReserveOffer>>>;
