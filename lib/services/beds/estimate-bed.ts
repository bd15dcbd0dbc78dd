import "server-only";
import { ApiError } from "@/lib/api/errors";
import { estimate, type EstimateResult } from "@/lib/calc/estimate";
import { pricedListings } from "@/db/match-candidates";
import { bedCosts, type BedCosts, type PricedPickup } from "@/lib/match/costs";
import type { LatLng } from "@/lib/match/types";
import type { EstimateInput } from "@/lib/validation/estimate";
import { planPickups } from "@/lib/services/match/plan-pickups";
import { needsOf } from "@/lib/beds/needs";
import { resolveContext, type Context } from "@/lib/context";

export interface PricedEstimate extends EstimateResult {
  /** What the bed will cost with the plan given or found: free, deposits held, paid. */
  costs?: BedCosts;
  /** The plan found, in brief, when the estimate was asked to match. */
  match?: { origin: LatLng; radius_km: number; stops: number; total_distance_km: number; driving_distance_km: number; trips: number };
}

/**
 * POST /api/estimate: the bed's estimate and, when asked, its costs — with the pickups of a
 * plan the gardener already has (their listings' own prices, read here, never the client's),
 * or with a plan matched here from the bed's needs.
 */
export async function estimateBed(input: EstimateInput, ctx: Context = {}): Promise<PricedEstimate> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const result = estimate(input, now);
  const needs = needsOf(result);
  if (input.plan) {
    const listings = await pricedListings(input.plan.items.map((i) => i.listing_id), q);
    const fields: Record<string, string> = {};
    const pickups: PricedPickup[] = input.plan.items.flatMap((item, i) => {
      const l = listings[item.listing_id];
      if (!l) {
        fields[`plan.items.${i}.listing_id`] = "That listing is not on offer.";
        return [];
      }
      return [{ ...l, listing_id: l.id, listing_quantity: item.quantity }];
    });
    if (Object.keys(fields).length) throw new ApiError("invalid_input", "Some pickups could not be priced.", fields);
    return { ...result, costs: bedCosts(pickups, needs) };
  }
  if (input.match) {
    const origin = input.match.origin ?? result.centroid!;
    const plan = await planPickups({ needs, origin, radius_km: input.match.radius_km }, null, { db: q, clock });
    return {
      ...result,
      costs: plan.costs,
      match: {
        origin,
        radius_km: input.match.radius_km,
        stops: plan.stops.length,
        total_distance_km: plan.total_distance_km,
        driving_distance_km: plan.driving_distance_km,
        trips: plan.trips.length,
      },
    };
  }
  return result;
}

