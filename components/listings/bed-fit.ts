// How one listing stands against what a bed still needs, in the listing's own units:
// "covers 6 of the 12 bags Plot 4 still needs". Pure, so the card and the lanes agree.
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { WHOLE_UNITS, type UnitSystem } from "@/lib/calc/units";
import { formatListingQuantity } from "@/lib/listings/format";
import { needPerListingUnit, unitContent } from "@/lib/match/units";
import type { ListingUnit, NeedUnit } from "@/lib/match/types";

export interface FitListing {
  material: MaterialCode;
  unit: ListingUnit;
  unit_size?: number | null;
  unit_mass_kg?: number | null;
  quantity_available: number;
}

export interface FitNeed {
  material: MaterialCode;
  unit: NeedUnit;
  /** Still needed, in the need's unit. */
  quantity: number;
}


/** The need in the listing's units, and how much of that the listing has; null when they cannot be compared. */
export function fitOf(l: FitListing, need: FitNeed): { needed: number; covered: number } | null {
  if (l.material !== need.material) return null;
  const per = needPerListingUnit({ material: l.material, unit: l.unit, unit_size: l.unit_size ?? null, unit_mass_kg: l.unit_mass_kg ?? null }, need.unit);
  if (!per) return null;
  const raw = need.quantity / per;
  const needed = WHOLE_UNITS.has(l.unit) ? Math.ceil(raw - 1e-9) : Math.round(raw * 10) / 10;
  return { needed, covered: Math.min(needed, l.quantity_available) };
}

export function fitLine(l: FitListing, need: FitNeed | undefined, bedName: string, system: UnitSystem): string | null {
  if (!need) return `${bedName} does not need ${MATERIALS[l.material].name.toLowerCase()}`;
  if (need.quantity <= 0) return `${bedName} already has all the ${MATERIALS[l.material].name.toLowerCase()} it needs`;
  const fit = fitOf(l, need);
  if (!fit) return null;
  const total = formatListingQuantity(fit.needed, l.unit, system);
  if (fit.covered >= fit.needed) return `covers all ${total} still needed for ${bedName}`;
  return `covers ${formatListingQuantity(fit.covered, l.unit, system).replace(/ \S+$/, "")} of the ${total} still needed for ${bedName}`;
}

/** Litres a listing's whole amount takes up as handed over, for the "how much" filter. */
export function handedLitres(l: FitListing): number {
  const c = unitContent({ material: l.material, unit: l.unit, unit_size: l.unit_size ?? null, unit_mass_kg: l.unit_mass_kg ?? null });
  return c ? c.volume_l * l.quantity_available : 0;
}
