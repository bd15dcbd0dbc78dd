import "server-only";
import { openNeedsInBox } from "@/db/needs";
import type { MaterialCode } from "@/lib/calc/facts";
import { demandRings, MIN_PEOPLE, PREVIEW_READ_KM, type DemandRing } from "@/lib/needs/demand";
import { cellOf } from "@/lib/needs/grid";
import { consume, LIMITS } from "@/lib/security/rate-limit";
import { resolveContext, type Context } from "@/lib/context";
import { dayOf } from "@/lib/services/needs/steps/day-of";
import { toDemandRow } from "@/lib/services/needs/steps/to-demand-row";

/** Past a cell's half-diagonal at both ends, a need counted between cell centres may lie this much further out, km. */
const CELL_SLACK_KM = 3;

export interface NearbyDemand {
  material: MaterialCode;
  rings: DemandRing[];
  min_people: number;
}

/**
 * GET /api/needs/nearby-demand: how many open needs a listing of `material` at a point would
 * serve within 5, 10 and 25 km, and what they add up to, in rounded, anonymous figures
 * (lib/needs/demand.ts). Counted per account, so nobody can sweep a town with it.
 */
export async function nearbyDemand(askerId: string, point: { lat: number; lng: number }, material: MaterialCode, ctx: Context = {}): Promise<NearbyDemand> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  await consume([[LIMITS.demandPreview, askerId]], clock, q);
  const centre = cellOf(point.lat, point.lng).centre;
  const rows = await openNeedsInBox({ centre, km: PREVIEW_READ_KM + CELL_SLACK_KM }, dayOf(now), [material], q);
  return { material, rings: demandRings(rows.map(toDemandRow), point, material, askerId), min_people: MIN_PEOPLE };
}
