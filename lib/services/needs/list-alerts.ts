import "server-only";
import type { Knex } from "knex";
import { packOf, type Pack } from "@/lib/listings/packs";
import type { MaterialCode } from "@/lib/calc/facts";
import type { ListingCaution } from "@/lib/calc/cautions";
import { datesState, effectiveStatus, quantityLeft } from "@/lib/listings/status";
import type { ListingUnit } from "@/lib/match/types";
import type { NeedView } from "@/lib/needs/view";
import type { ReserveOffer } from "@/lib/services/reservations/load-reserve-offer";
import { resolveContext, type Context } from "@/lib/services/context";

/** An in-app notice: a listing that could serve one of my open needs (public facts about it only). */
export interface AlertView {
  id: string;
  created_at: string;
  seen: boolean;
  need: { id: string; material: MaterialCode; status: string; bed: { id: string; name: string } | null };
  listing: {
    id: string;
    title: string;
    material: MaterialCode;
    supplier: string;
    /** From the need's place to the listing's public point. */
    distance_km: number;
    quantity_available: number;
    unit: ListingUnit;
    price_cents: number;
    /** Sold by the pack: whole packs at the pack price (lib/listings/packs.ts). */
    pack: Pack | null;
    deposit_cents: number;
    currency: string;
    status: string;
    reservable_from: string | null;
  };
}

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

/** GET /api/needs/alerts: my notices, newest first, for needs still open (or all of them). */
export async function listAlerts(userId: string, opts: { openOnly?: boolean } = {}, ctx: Context = {}): Promise<AlertView[]> {
  const { db: q, clock } = resolveContext(ctx);
  const b = alertQuery(q, userId).orderBy([{ column: "a.created_at", order: "desc" }, { column: "a.id", order: "desc" }]).limit(200);
  if (opts.openOnly) b.andWhere("n.status", "open");
  const now = clock();
  return ((await b) as AlertJoin[]).map((r) => toView(r, now));
}

export interface AlertPage {
  alert: AlertView;
  need: NeedView;
  offer: ReserveOffer | null;
  cautions: ListingCaution[];
  /** What one click reserves, in the listing's unit (0: nothing to reserve). */
  amount: number;
}

