import "server-only";
import { newId } from "@/db/index";
import { activeListingsAround } from "@/db/listings";
import { insertAlerts } from "@/db/need-alerts";
import type { NeedAlertRow, NeedRow } from "@/db/types";
import { servingDistance } from "@/lib/needs/reaching";
import { alertingListing } from "@/lib/services/needs/steps/alerting-listing";
import { resolveContext, type Context } from "@/lib/context";

/** The nearest listings already on offer that a new need is shown at once: a product choice, enough to choose from. */
export const LISTINGS_ON_OPENING = 20;
/** How many listings in the need's box are read at most before the nearest are picked. */
const READ_AT_MOST = 2_000;

/** A need as stored (its needed_by a calendar day, as db/needs.ts hands it back). */
export type NoticedNeed = Pick<NeedRow, "id" | "owner_id" | "material_code" | "unit" | "radius_km" | "lat" | "lng" | "needed_by" | "status">;

/**
 * A need opened (or moved, widened, redated or opened again) where listings that could serve
 * it are already on offer: the nearest of them become in-app notices at once, by the same
 * rule as alerts (servingDistance). No e-mail, now or in a digest: the gardener is in the app
 * as it happens; mail is for what is listed later. A notice already there is kept as it was.
 */
export async function noticeListingsFor(need: NoticedNeed, ctx: Context = {}): Promise<number> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  if (need.status !== "open") return 0;
  const found: { listing_id: string; km: number }[] = [];
  for (const l of await activeListingsAround(need.material_code, { lat: Number(need.lat), lng: Number(need.lng) }, Number(need.radius_km), need.owner_id, READ_AT_MOST, q)) {
    const alerting = alertingListing(l, now);
    const km = alerting ? servingDistance(alerting, need) : null;
    if (km !== null) found.push({ listing_id: l.id, km });
  }
  const at = now.toISOString();
  const rows: NeedAlertRow[] = found
    .sort((a, b) => a.km - b.km)
    .slice(0, LISTINGS_ON_OPENING)
    .map((f) => ({
      id: newId(),
      need_id: need.id,
      listing_id: f.listing_id,
      user_id: need.owner_id,
      distance_km: Math.round(f.km * 1000) / 1000,
      // Neither an e-mail nor the digest carries it, and it does not count as a digest sent.
      delivery: "in_app",
      emailed_at: null,
      seen_at: null,
      dismissed_at: null,
      created_at: at,
    }));
  await insertAlerts(rows, q);
  return rows.length;
}
