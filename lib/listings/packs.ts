// Listings sold by the pack: a live culture priced at so much for a pack of a set weight
// ("€14.00 a 0.5 kg pack") rather than per kg. Quantities everywhere stay in the listing's
// own unit (kg), so holds, what is left and the match read the same columns as for any
// listing; a pack listing only ever gives whole packs, and its price is packs × pack price.
// Pure: the form, the reserve page, the match and the server all count packs the same way.
import { formatMoney } from "@/lib/format/money";
import { formatListingQuantity, formatPrice } from "./format";
import type { UnitSystem, ListingUnit } from "@/lib/calc/units";

export interface Pack {
  /** In the listing's unit (kg for a culture). */
  size: number;
  price_cents: number;
}

export interface PackColumns {
  pack_size?: number | string | null;
  pack_price_cents?: number | string | null;
}

const EPS = 1e-9;

/** The pack a listing is sold by, or null when it is priced per unit. */
export function packOf(l: PackColumns): Pack | null {
  if (l.pack_size == null || l.pack_price_cents == null) return null;
  const size = Number(l.pack_size);
  const price = Number(l.pack_price_cents);
  return size > 0 && Number.isFinite(price) ? { size, price_cents: price } : null;
}

/** The price per unit a pack works out at, kept in price_cents for browse, sorting and the free filter. */
export function unitPriceOfPack(p: Pack): number {
  return Math.round(p.price_cents / p.size);
}

/** How many whole packs `quantity` is, or null when it is not a whole number of them. */
export function packsIn(quantity: number, p: Pack): number | null {
  const n = quantity / p.size;
  const whole = Math.round(n);
  return whole > 0 && Math.abs(n - whole) < 1e-6 ? whole : null;
}

/** The whole packs that fit in `quantity` (what is left, a cap), never a part of one. */
export function wholePacks(quantity: number, p: Pack): number {
  return Math.max(0, Math.floor(quantity / p.size + 1e-6));
}

/** A quantity in the listing's unit, rounded so 3 packs of 0.3 kg are 0.9 kg, not 0.8999999. */
export function packQuantity(packs: number, p: Pack): number {
  return Number((packs * p.size).toFixed(6));
}

/** The fewest whole packs holding at least `quantity`. */
export function packsCovering(quantity: number, p: Pack): number {
  return Math.max(0, Math.ceil(quantity / p.size - 1e-6));
}

/**
 * The pack's own weight in brackets after the reader's figure, "(0.5 kg)", held together by a
 * no-break space so a narrow column never leaves "(0.5" on one line and "kg)" on the next.
 */
const bracketed = (own: string) => `(${own.replace(/ /g, "\u00a0")})`;

/** A pack's size: "0.5 kg", or for an imperial reader "1.1 lb" with `(0.5 kg)` put after `noun`. */
function packSize(p: Pack, unit: ListingUnit, system: UnitSystem, noun = ""): string {
  const own = formatListingQuantity(p.size, unit);
  return system === "metric" ? `${own}${noun}` : `${formatListingQuantity(p.size, unit, system)}${noun} ${bracketed(own)}`;
}

/** "a 0.5 kg pack" or, for an imperial reader, "a 1.1 lb pack (0.5 kg)". */
export function packWords(p: Pack, unit: ListingUnit, system: UnitSystem = "metric"): string {
  return `a ${packSize(p, unit, system, " pack")}`;
}

/** "€14.00 a 0.5 kg pack". */
export function formatPackPrice(p: Pack, currency: string, unit: ListingUnit, system: UnitSystem = "metric"): string {
  return p.price_cents === 0 ? "Free" : `${formatMoney(p.price_cents, currency)} ${packWords(p, unit, system)}`;
}

/** "3 packs" / "1 pack". */
export function packCount(n: number): string {
  return `${n} ${n === 1 ? "pack" : "packs"}`;
}

/** Why `quantity` is not whole packs (for a form or the API), or null. */
export function wholePackProblem(quantity: number, p: Pack, unit: ListingUnit, system: UnitSystem = "metric"): string | null {
  if (packsIn(quantity, p) !== null || quantity <= EPS) return null;
  return `This culture comes in whole packs of ${packSize(p, unit, system)}: reserve ${[1, 2, 3].map((n) => formatListingQuantity(packQuantity(n, p), unit)).join(", ")} and so on.`;
}

/** A listing's price as every screen shows it: per pack for a pack listing, else per unit ("£4.00 a bale"). */
export function formatListingPrice(l: { price_cents: number; currency: string; unit: ListingUnit; pack?: Pack | null }, system: UnitSystem = "metric"): string {
  return l.pack ? formatPackPrice(l.pack, l.currency, l.unit, system) : formatPrice(l.price_cents, l.currency, l.unit, system);
}
