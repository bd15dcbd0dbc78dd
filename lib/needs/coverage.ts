// How much of a need reservations already cover. A reservation counts when it was made for
// the need (from an alert), or when it was made for the need's bed, for the same material,
// after the need was opened (the bed's own plan, reserved later). Quantities are turned into
// the need's unit with the same factors matching uses (lib/match/units.ts).
import { packQuantity, packsCovering, wholePacks } from "@/lib/listings/packs";
import type { MaterialCode } from "@/lib/calc/facts";
import { WHOLE_UNITS } from "@/lib/calc/units";
import { needPerListingUnit } from "@/lib/match/units";
import type { CandidateListing, ListingUnit, NeedUnit } from "@/lib/match/types";

export interface CoveredNeed {
  id: string;
  bed_id: string | null;
  material_code: MaterialCode;
  quantity: number;
  unit: NeedUnit;
  created_at: string;
}

export interface CountedReservation {
  need_id: string | null;
  bed_id: string | null;
  status: string;
  quantity: number;
  created_at: string;
  material_code: MaterialCode;
  unit: string;
  unit_size: number | null;
  unit_mass_kg: number | null;
}

export interface Coverage {
  /** Held, confirmed or collected, in the need's unit. */
  reserved: number;
  /** Confirmed or collected only: what the need can count as met. */
  settled: number;
}

/** A need counts as met once settled reservations reach it (to within rounding). */
export const MET_SHARE = 0.999;

export function counts(need: CoveredNeed, r: CountedReservation): boolean {
  if (r.need_id) return r.need_id === need.id;
  return !!need.bed_id && r.bed_id === need.bed_id && r.material_code === need.material_code && r.created_at >= need.created_at;
}

export function coverage(need: CoveredNeed, reservations: readonly CountedReservation[]): Coverage {
  let reserved = 0;
  let settled = 0;
  for (const r of reservations) {
    if (!counts(need, r)) continue;
    const per = needPerListingUnit({ material: r.material_code, unit: r.unit as ListingUnit, unit_size: r.unit_size, unit_mass_kg: r.unit_mass_kg }, need.unit);
    if (per === null) continue;
    reserved += r.quantity * per;
    if (r.status === "confirmed" || r.status === "collected") settled += r.quantity * per;
  }
  return { reserved, settled };
}

export const isMet = (need: { quantity: number }, c: Coverage) => c.settled >= need.quantity * MET_SHARE;

/** A listing as the amount to reserve from it is worked out: its unit, what is left (whole sheets, bags and bales), its cap. */
export type ReservableListing = Pick<CandidateListing, "material" | "unit" | "unit_size" | "unit_mass_kg" | "available" | "max_per_reservation" | "pack">;


/**
 * What one click reserves for a need: what it still lacks, in the listing's unit, rounded up
 * to whole sheets, bags, bales or packs (or to 0.01 of a measured unit), and no more than the
 * listing has left or lets one person take. 0 when nothing is lacking or nothing can be had.
 */
export function amountToReserve(left: number, unit: NeedUnit, l: ReservableListing): number {
  const per = needPerListingUnit(l, unit);
  if (per === null || left <= 0) return 0;
  const raw = left / per;
  // Sold by the pack: enough whole packs, as many as are left and the cap allows.
  if (l.pack) {
    const cap = wholePacks(Math.min(l.available, l.max_per_reservation ?? Infinity), l.pack);
    return packQuantity(Math.min(packsCovering(raw, l.pack), cap), l.pack);
  }
  const whole = WHOLE_UNITS.has(l.unit);
  const wanted = whole ? Math.ceil(raw - 1e-9) : Math.ceil(raw * 100 - 1e-9) / 100;
  const cap = Math.min(whole ? Math.floor(l.available + 1e-9) : l.available, l.max_per_reservation ?? Infinity);
  return Math.max(0, Math.min(wanted, cap));
}
