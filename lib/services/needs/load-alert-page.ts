import "server-only";
import { markAlertsSeen } from "@/db/need-alerts";
import { findOwnNeed } from "@/db/needs";
import { listingCautions } from "@/lib/calc/cautions";
import { amountToReserve } from "@/lib/needs/coverage";
import type { ListingCaution } from "@/lib/calc/cautions";
import type { NeedView } from "@/lib/needs/view";
import { loadReserveOffer, type ReserveOffer } from "@/lib/services/reservations/load-reserve-offer";
import { resolveContext, type Context } from "@/lib/context";
import { needViews } from "@/lib/services/needs/steps/need-views";
import { findListingFacts } from "@/db/listings";
import type { AlertView } from "@/lib/services/needs/list-alerts";
import { alertQuery, type AlertJoin } from "@/lib/services/needs/steps/alert-query";
import { toView } from "@/lib/services/needs/steps/alert-view";

export interface AlertPage {
  alert: AlertView;
  need: NeedView;
  offer: ReserveOffer | null;
  cautions: ListingCaution[];
  /** What one click reserves, in the listing's unit (0: nothing to reserve). */
  amount: number;
}

/** The alert page: the notice, my need as it stands, the listing's reservable facts, and what one click takes. Marks it seen. */
export async function loadAlertPage(userId: string, id: string, ctx: Context = {}): Promise<AlertPage | null> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const row = (await alertQuery(q, userId).andWhere("a.id", id).first()) as AlertJoin | undefined;
  if (!row) return null;
  const needRow = await findOwnNeed(row.need_id, userId, q);
  if (!needRow) return null;
  const [need] = await needViews([needRow], q, now);
  const offer = await loadReserveOffer(row.listing_id, { db: q, clock: () => now });
  const listing = await findListingFacts(row.listing_id, q);
  // An unreadable declaration reads as none: the material's general cautions still apply.
  const cautions = listingCautions({ material: row.material_code, unit: row.unit, unit_mass_kg: listing?.unit_mass_kg ?? null, quality: listing?.quality ?? {} });
  const amount =
    offer && need.status === "open"
      ? amountToReserve(need.quantity_left, need.unit, {
          material: offer.material,
          unit: offer.unit,
          unit_size: offer.unit_size,
          unit_mass_kg: offer.unit_mass_kg,
          // Already whole sheets, bags, bales or packs (lib/reservations/labels.ts).
          available: offer.available,
          max_per_reservation: offer.max_per_reservation,
          pack: offer.pack,
        })
      : 0;
  await markAlertsSeen(userId, [id], now.toISOString(), q);
  return { alert: toView(row, now), need, offer, cautions, amount };
}
