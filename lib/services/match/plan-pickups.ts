import "server-only";
import { ApiError, notFound } from "@/lib/api/errors";
import type { SessionUser } from "@/lib/auth/current-user";
import { databaseSource, pricedListings } from "@/db/match-candidates";
import { bedCosts, type PricedPickup } from "@/lib/match/costs";
import { searchPlan } from "@/lib/match/search";
import type { LatLng, Need } from "@/lib/match/types";
import type { MatchInput } from "@/lib/validation/match";
import { findBed } from "@/db/beds";
import { pickupWindowsOf } from "@/db/reservations";
import { depositFor } from "@/lib/payments/money";
import { answerByFor, pickupChoices } from "@/lib/reservations/pickup-choices";
import { bedNeeds } from "@/lib/beds/needs";
import { resolveContext, type Context } from "@/lib/context";

/** POST /api/match: the pickup plan for ad-hoc needs, or for one of the signed-in gardener's beds. */
export async function planPickups(input: MatchInput, user: SessionUser | null, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  let needs = input.needs as Need[] | undefined;
  let origin: LatLng | undefined = input.origin;
  let bed: { id: string; name: string } | null = null;
  if (input.bed_id) {
    if (!user) throw new ApiError("unauthenticated", "Sign in to find materials for a saved bed.");
    const row = await findBed(input.bed_id, user.id, q);
    if (!row) throw notFound("That bed");
    bed = { id: row.id, name: row.name };
    needs ??= bedNeeds(row);
    if (!origin) {
      if (row.lat === null || row.lng === null) {
        throw new ApiError("invalid_input", "This bed has no location yet.", { origin: "Give the origin as {lat, lng}, or add the bed's location" });
      }
      origin = { lat: Number(row.lat), lng: Number(row.lng) };
    }
  }
  if (!needs || !origin) throw new ApiError("invalid_input", "Some fields need another look.", { needs: "Give the needs and the origin" });

  const { plan, stats } = await searchPlan(needs, origin, input.radius_km, databaseSource(q, now), {
    costs: { cost_per_km_cents: input.cost_per_km_cents, cost_per_stop_cents: input.cost_per_stop_cents },
    vehicle: input.vehicle,
  });
  const ids = plan.allocations.map((a) => a.listing_id);
  const [listings, windows] = await Promise.all([pricedListings(ids, q), pickupWindowsOf(ids, q)]);
  const pickups: PricedPickup[] = plan.allocations.flatMap((a) => {
    const l = listings[a.listing_id];
    return l ? [{ ...l, listing_id: l.id, listing_quantity: a.listing_quantity }] : [];
  });
  return {
    ...plan,
    allocations: plan.allocations.map((a) => {
      const l = listings[a.listing_id] as (typeof listings)[string] | undefined;
      const terms = { owes: a.cost_cents > 0 || depositFor(l?.price_cents ?? 0, l?.deposit_cents ?? 0) > 0, autoAccept: !!l?.auto_accept };
      return {
        ...a,
        title: l?.title,
        supplier: l?.supplier,
        deposit_cents: l?.deposit_cents ?? 0,
        // What reserving this stop asks: its pickup times (a parcel has none) and the supplier's answer.
        auto_accept: terms.autoAccept,
        pickup_choices: a.fulfilment === "post" ? [] : pickupChoices(windows.filter((w) => w.listing_id === a.listing_id), now, terms),
        answer_by_no_window: answerByFor(now, terms, null),
      };
    }),
    /** What the plan costs: free pickups, deposits held until pickup, and what is paid. */
    costs: bedCosts(pickups, needs, plan.unmet),
    origin,
    radius_km: input.radius_km,
    bed,
    search: stats,
  };
}

export type PickupPlanResponse = Awaited<ReturnType<typeof planPickups>>;
