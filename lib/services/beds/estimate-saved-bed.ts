import "server-only";
import type { UnitSystem } from "@/lib/calc/units";
import { DEFAULT_RADIUS_KM } from "@/lib/match/defaults";
import { bedEstimate, type BedView } from "@/lib/beds/view";
import { planPickups } from "@/lib/services/match/plan-pickups";
import { needsOf } from "@/lib/beds/needs";
import { PricedEstimate } from "@/lib/services/beds/estimate-bed";
import { resolveContext, type Context } from "@/lib/context";

/**
 * A saved bed's estimate in the gardener's units, priced from the listings nearest its place
 * when it has one. A failed search leaves the costs out rather than the page.
 */
export async function savedBedEstimate(bed: BedView, units: UnitSystem, ctx: Context = {}): Promise<PricedEstimate> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const base = bedEstimate(bed, now, units);
  if (!bed.location) return base;
  try {
    const plan = await planPickups({ needs: needsOf(base), origin: bed.location, radius_km: DEFAULT_RADIUS_KM }, null, { db: q, clock });
    return { ...base, costs: plan.costs };
  } catch (err) {
    console.error(`[bed ${bed.id}] pricing failed:`, err instanceof Error ? err.message : err);
    return base;
  }
}
