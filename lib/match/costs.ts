// What a bed will cost, from the pickups of a matched plan: what is free, what a refundable
// deposit holds on the card until pickup, and what is paid for. Pure, so the planner, the
// saved bed and the match page all add it up the same way.
import type { MaterialCode } from "@/lib/calc/facts";
import { depositFor, listingPrice } from "@/lib/payments/money";
import type { Pack } from "@/lib/listings/packs";
import type { ListingUnit, Need } from "./types";
import { needPerListingUnit, type ListingShape } from "./units";

/** One pickup of a plan with its listing's price (per listing unit) and deposit (per reservation). */
export interface PricedPickup extends ListingShape {
  listing_id: string;
  title?: string;
  supplier?: string;
  listing_quantity: number;
  price_cents: number;
  /** Sold by the pack: whole packs at the pack price. */
  pack?: Pack | null;
  deposit_cents: number;
  currency: string;
}

export type CostKind = "free" | "deposit" | "paid";

export interface CostLine {
  listing_id: string;
  material: MaterialCode;
  title?: string;
  supplier?: string;
  listing_quantity: number;
  listing_unit: ListingUnit;
  currency: string;
  /** What is paid for this pickup. */
  cost_cents: number;
  /** What a refundable deposit holds on the card until the pickup. */
  deposit_cents: number;
  kind: CostKind;
}

export interface CurrencyTotals {
  currency: string;
  /** Paid to suppliers. */
  to_pay_cents: number;
  /** Held on the card and released at pickup (kept only for a no-show). */
  deposits_cents: number;
  free_pickups: number;
  deposit_pickups: number;
  paid_pickups: number;
}

export interface MaterialCost {
  material: MaterialCode;
  currency: string;
  cost_cents: number;
  deposit_cents: number;
  pickups: number;
}

export interface BedCosts {
  lines: CostLine[];
  /** One entry per currency the plan's listings are priced in (usually one). */
  totals: CurrencyTotals[];
  /** Per material, so each line of the estimate can show its price before reserving. */
  by_material: MaterialCost[];
  /** What the plan leaves uncovered, in the needs' units. */
  unmet: Need[];
}

const UNMET_TOLERANCE = 1e-6;

/**
 * The costs of these pickups. When `needs` are given, whatever the pickups do not cover of
 * them is listed as unmet (a plan from /api/match already says; items chosen by hand may not).
 */
export function bedCosts(pickups: readonly PricedPickup[], needs: readonly Need[] = [], unmet?: readonly Need[]): BedCosts {
  const lines: CostLine[] = pickups.map((p) => {
    const cost_cents = listingPrice(p, p.listing_quantity);
    const deposit_cents = depositFor(p.price_cents, p.deposit_cents);
    return {
      listing_id: p.listing_id,
      material: p.material,
      ...(p.title ? { title: p.title } : {}),
      ...(p.supplier ? { supplier: p.supplier } : {}),
      listing_quantity: p.listing_quantity,
      listing_unit: p.unit,
      currency: p.currency,
      cost_cents,
      deposit_cents,
      kind: cost_cents > 0 ? "paid" : deposit_cents > 0 ? "deposit" : "free",
    };
  });
  const totals = new Map<string, CurrencyTotals>();
  const byMaterial = new Map<string, MaterialCost>();
  for (const l of lines) {
    const t = totals.get(l.currency) ?? { currency: l.currency, to_pay_cents: 0, deposits_cents: 0, free_pickups: 0, deposit_pickups: 0, paid_pickups: 0 };
    t.to_pay_cents += l.cost_cents;
    t.deposits_cents += l.deposit_cents;
    t[`${l.kind}_pickups`] += 1;
    totals.set(l.currency, t);
    const key = `${l.material}|${l.currency}`;
    const m = byMaterial.get(key) ?? { material: l.material, currency: l.currency, cost_cents: 0, deposit_cents: 0, pickups: 0 };
    m.cost_cents += l.cost_cents;
    m.deposit_cents += l.deposit_cents;
    m.pickups += 1;
    byMaterial.set(key, m);
  }
  return { lines, totals: [...totals.values()], by_material: [...byMaterial.values()], unmet: unmet ? [...unmet] : uncovered(pickups, needs) };
}

/** The part of each need that these pickups do not cover. */
function uncovered(pickups: readonly PricedPickup[], needs: readonly Need[]): Need[] {
  return needs.flatMap((n) => {
    const covered = pickups
      .filter((p) => p.material === n.material)
      .reduce((sum, p) => sum + (needPerListingUnit(p, n.unit) ?? 0) * p.listing_quantity, 0);
    const left = n.quantity - covered;
    return left > UNMET_TOLERANCE * Math.max(1, n.quantity) ? [{ ...n, quantity: Math.round(left * 1000) / 1000 }] : [];
  });
}
