import "server-only";
import type { Db } from "@/db/index";
import { moveNeedStatus, needsLinkedTo, reservationsCounting } from "@/db/needs";
import type { ReservationRow } from "@/db/types";
import { coverage, isMet } from "@/lib/needs/coverage";
import { dayOf } from "@/lib/services/needs/steps/day-of";

/**
 * Inside a reservation's transaction, after its status changed: a need it counts towards is
 * met once confirmed or collected reservations cover it, and open again (while its date is
 * still to come) if one of those ends and it is no longer covered.
 */
export async function settleNeedsAfter(trx: Db, r: Pick<ReservationRow, "need_id" | "bed_id" | "gardener_id" | "listing_id">, now: Date): Promise<void> {
  if (!r.need_id && !r.bed_id) return;
  const listing = await trx("listings").first("material_code").where({ id: r.listing_id });
  if (!listing) return;
  const needs = (await needsLinkedTo(r, listing.material_code, trx)).filter((n) => n.status === "open" || n.status === "met");
  if (!needs.length) return;
  const reservations = await reservationsCounting(needs, trx);
  const at = now.toISOString();
  for (const n of needs) {
    const met = isMet(n, coverage(n, reservations));
    if (n.status === "open" && met) await moveNeedStatus(n.id, ["open"], "met", at, trx);
    else if (n.status === "met" && !met && n.needed_by >= dayOf(now)) await moveNeedStatus(n.id, ["met"], "open", at, trx);
  }
}
