import "server-only";
import { packOf } from "@/lib/listings/packs";
import { datesState, effectiveStatus, quantityLeft } from "@/lib/listings/status";
import type { AlertView } from "@/lib/services/needs/list-alerts";
import type { AlertJoin } from "@/lib/services/needs/steps/alert-query";

/** A notice as its reader sees it at `now`: the listing's status then, and whether it can be reserved yet. */
export function toView(r: AlertJoin, now: Date): AlertView {
  const status = effectiveStatus(r.status as never, r.available_until, now);
  return {
    id: r.id,
    created_at: r.created_at,
    seen: r.seen_at !== null,
    need: { id: r.need_id, material: r.need_material, status: r.need_status, bed: r.bed_id && r.bed_name ? { id: r.bed_id, name: r.bed_name } : null },
    listing: {
      id: r.listing_id,
      title: r.title,
      material: r.material_code,
      supplier: r.supplier,
      distance_km: Math.round(Number(r.distance_km) * 10) / 10,
      quantity_available: quantityLeft(r),
      unit: r.unit,
      price_cents: Number(r.price_cents),
      pack: packOf(r),
      deposit_cents: Number(r.price_cents) > 0 ? 0 : Number(r.deposit_cents),
      currency: r.currency,
      status,
      reservable_from: datesState(r, now) === "not_yet" ? r.available_from : null,
    },
  };
}
