// Money is integer cents plus a currency everywhere; how it reads is lib/format/money.ts.
import { packsCovering, type Pack } from "@/lib/listings/packs";

// Stripe's smallest card charge per currency (docs.stripe.com/currencies, "Minimum and
// maximum charge amounts"; from memory). Checked before holding, so a too-small total is a
// clear 422 rather than a checkout that cannot start.
export const MIN_CARD_CHARGE_CENTS: Record<string, number> = { eur: 50, usd: 50, gbp: 30 };

/** The refundable no-show deposit a reservation holds: free listings only, since a price is commitment enough. */
export function depositFor(unitPriceCents: number, depositCents: number): number {
  return unitPriceCents > 0 ? 0 : depositCents;
}

/** The price of a reservation: a per-unit price times a quantity that may be fractional (m³, kg). */
export function priceFor(unitPriceCents: number, quantity: number): number {
  return Math.round(unitPriceCents * quantity);
}

/**
 * What `quantity` of a listing costs: whole packs at the pack price for a listing sold by the
 * pack (part of a pack costs the whole pack; a reservation is refused unless it is whole
 * packs), else its price per unit times the quantity. One rule for the reserve form, the
 * server's charge and a plan's estimate.
 */
export function listingPrice(l: { price_cents: number; pack?: Pack | null }, quantity: number): number {
  return l.pack ? packsCovering(quantity, l.pack) * l.pack.price_cents : priceFor(l.price_cents, quantity);
}
