import "server-only";
import type { Pack } from "@/lib/listings/packs";
import type { MaterialCode } from "@/lib/calc/facts";
import type { ListingUnit } from "@/lib/match/types";
import { resolveContext, type Context } from "@/lib/context";
import { alertQuery, type AlertJoin } from "@/lib/services/needs/steps/alert-query";
import { toView } from "@/lib/services/needs/steps/alert-view";

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

/** GET /api/needs/alerts: my notices, newest first, for needs still open (or all of them). */
export async function listAlerts(userId: string, opts: { openOnly?: boolean } = {}, ctx: Context = {}): Promise<AlertView[]> {
  const { db: q, clock } = resolveContext(ctx);
  const b = alertQuery(q, userId).orderBy([{ column: "a.created_at", order: "desc" }, { column: "a.id", order: "desc" }]).limit(200);
  if (opts.openOnly) b.andWhere("n.status", "open");
  const now = clock();
  return ((await b) as AlertJoin[]).map((r) => toView(r, now));
}
