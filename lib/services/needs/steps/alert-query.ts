import "server-only";
import type { Knex } from "knex";
import type { MaterialCode } from "@/lib/calc/facts";
import type { ListingUnit } from "@/lib/match/types";

/** One of my notices as alertQuery reads it: the alert, its need and bed, the listing and its supplier. */
export interface AlertJoin {
  id: string;
  created_at: string;
  seen_at: string | null;
  distance_km: number;
  need_id: string;
  need_material: MaterialCode;
  need_status: string;
  bed_id: string | null;
  bed_name: string | null;
  listing_id: string;
  title: string;
  material_code: MaterialCode;
  supplier: string;
  unit: ListingUnit;
  quantity_total: number;
  quantity_held: number;
  quantity_collected: number;
  price_cents: number;
  pack_size: number | null;
  pack_price_cents: number | null;
  deposit_cents: number;
  currency: string;
  status: string;
  available_from: string | null;
  available_until: string | null;
}

/** My notices that are not dismissed, joined to what a notice shows: the start of every read of them. */
export function alertQuery(q: Knex, userId: string) {
  return q("need_alerts as a")
    .join("needs as n", "n.id", "a.need_id")
    .join("listings as l", "l.id", "a.listing_id")
    .join("users as s", "s.id", "l.owner_id")
    .leftJoin("organisations as o", "o.id", "l.organisation_id")
    .leftJoin("beds as b", "b.id", "n.bed_id")
    .select(
      "a.id",
      "a.created_at",
      "a.seen_at",
      "a.distance_km",
      "a.need_id",
      "n.material_code as need_material",
      "n.status as need_status",
      "n.bed_id",
      "b.name as bed_name",
      "a.listing_id",
      "l.title",
      "l.material_code",
      // A council's listing is the council's, whoever typed it in (as on the listing page).
      q.raw("coalesce(o.name, s.display_name) as supplier"),
      "l.unit",
      "l.quantity_total",
      "l.quantity_held",
      "l.quantity_collected",
      "l.price_cents",
      "l.pack_size",
      "l.pack_price_cents",
      "l.deposit_cents",
      "l.currency",
      "l.status",
      "l.available_from",
      "l.available_until",
    )
    .where("a.user_id", userId)
    .whereNull("a.dismissed_at");
}
