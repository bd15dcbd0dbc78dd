// How a reservation's quantity and money read in pages and e-mails.
import { formatListingQuantity } from "@/lib/listings/format";
import { type UnitSystem, WHOLE_UNITS, type ListingUnit } from "@/lib/calc/units";
import { packQuantity, wholePacks, type Pack } from "@/lib/listings/packs";
import { formatMoney } from "@/lib/format/money";

/** Units counted in whole pieces: nobody collects half a bale. */

/**
 * What of `available` can be reserved: whole sheets, bags and bales, whole packs of a listing
 * sold by the pack (nobody can take 0.7 of a bale, whatever the listing's total says).
 */
export function reservableQuantity(available: number, unit: string, pack: Pack | null): number {
  if (pack) return packQuantity(wholePacks(available, pack), pack);
  return WHOLE_UNITS.has(unit) ? Math.floor(available + 1e-9) : available;
}

/** "3 bales", "0.5 kg" (or "1.1 lb" for an imperial reader); e-mails read in the listing's own unit. */
export function quantityLabel(quantity: number, unit: string, system: UnitSystem = "metric"): string {
  return formatListingQuantity(quantity, unit as ListingUnit, system);
}

/**
 * A quantity typed in the listing's own unit, for a form's hints and messages: the reader's
 * unit first, the one they type in after it ("26 lb (12 kg)"), so an imperial reader is never
 * shown a metric figure alone.
 */
export function typedQuantityLabel(quantity: number, unit: string, system: UnitSystem): string {
  const own = quantityLabel(quantity, unit);
  return system === "metric" || WHOLE_UNITS.has(unit) ? own : `${quantityLabel(quantity, unit, system)} (${own})`;
}

export function whatLabel(r: { quantity: number; listing: { unit: string; title: string } }, system: UnitSystem = "metric"): string {
  return `${quantityLabel(r.quantity, r.listing.unit, system)} of ${r.listing.title}`;
}

export type MoneyOutcome = "returned" | "kept" | "none";

/** One sentence on what happens to the gardener's money, for e-mails and pages. */
export function moneySentence(r: { amount_cents: number; deposit_cents: number; currency: string; payment_state: string }, outcome: MoneyOutcome): string | null {
  const price = r.amount_cents > 0;
  const cents = price ? r.amount_cents : r.deposit_cents;
  if (cents === 0 || outcome === "none") return null;
  const money = formatMoney(cents, r.currency);
  if (r.payment_state === "awaiting" || r.payment_state === "unpaid") return "Nothing was paid, so there is nothing to refund; the checkout link no longer works.";
  if (outcome === "returned") {
    return price ? `Your payment of ${money} is refunded in full; it shows on your card within a few days.` : `The ${money} deposit hold on your card is released: nothing is taken.`;
  }
  return price ? `The ${money} you paid is not refunded.` : `The ${money} deposit is kept, as the listing said it would be for a no-show or a late cancellation.`;
}

/**
 * Why `quantity` cannot be reserved, or null: the tighter of what is left and the listing's
 * cap per reservation speaks, so nobody is told "at most 10" when 8 are left.
 */
export function quantityLimitProblem(quantity: number, l: { available: number; max_per_reservation: number | null; unit: string }, system: UnitSystem = "metric"): string | null {
  const cap = l.max_per_reservation;
  if (cap !== null && cap < l.available) return quantity > cap + 1e-9 ? `At most ${typedQuantityLabel(cap, l.unit, system)} per reservation on this listing.` : null;
  if (quantity > l.available + 1e-9) return l.available > 0 ? `Only ${typedQuantityLabel(l.available, l.unit, system)} left.` : "Nothing is left.";
  return null;
}
