// The whole pickup plan from needs and candidate listings: what to take from where, the
// visiting order, the carloads and the cautions. Pure: no I/O, so it is tested and
// benchmarked on its own.
import { CAUTION_TEXT } from "@/lib/calc/cautions";
import { NIOSH_LIFT_LIMIT_KG, NIOSH_LIFT_LIMIT_LB, type MaterialCode } from "@/lib/calc/facts";
import { roundTo } from "@/lib/calc/numbers";
import { kgToLb } from "@/lib/calc/units";
import { materialNoun } from "./format";
import { allocate, type AllocationResult } from "./allocate";
import { type CostOptions, DEFAULT_COSTS, DEFAULT_VEHICLE } from "./defaults";
import { splitTrips, type Vehicle } from "./trips";
import type { Allocation, CandidateListing, Caution, LatLng, MatchPlan, Need } from "./types";
import { convertNeed, unitContent } from "./units";

export interface PlanOptions {
  costs?: Partial<CostOptions>;
  vehicle?: Partial<Vehicle>;
  /** Listing ids to start the search from (a plan over fewer candidates). */
  warm?: readonly string[];
}

/** One need per material: later ones are converted into the first one's unit and added. */
export function mergeNeeds(needs: readonly Need[]): Need[] {
  const out: Need[] = [];
  for (const n of needs) {
    const same = out.find((o) => o.material === n.material);
    if (same) same.quantity += convertNeed(n.material, n.quantity, n.unit, same.unit);
    else out.push({ ...n });
  }
  return out;
}

// Below a thousandth of a unit (a litre, a gram) is rounding, not a shortfall.
const UNMET_TOLERANCE = 1e-3;

export function resolveCosts(costs?: Partial<CostOptions>): CostOptions {
  return { ...DEFAULT_COSTS, ...Object.fromEntries(Object.entries(costs ?? {}).filter(([, v]) => v !== undefined)) };
}

function materialCautions(materials: Set<MaterialCode>): Caution[] {
  const notes: string[] = [];
  if (materials.has("cardboard")) notes.push(CAUTION_TEXT.cardboard);
  if (materials.has("leaves")) notes.push(CAUTION_TEXT.roadsideLeaves);
  if (["straw", "manure", "grass_clippings", "compost"].some((m) => materials.has(m as MaterialCode))) notes.push(CAUTION_TEXT.herbicide);
  if (materials.has("worms")) notes.push(CAUTION_TEXT.worms);
  if (materials.size) notes.push(CAUTION_TEXT.gloves, CAUTION_TEXT.defer);
  return notes.map((message) => ({ kind: "material" as const, message }));
}

function liftingCaution(heavy: Allocation[]): Caution | null {
  if (!heavy.length) return null;
  const items = heavy
    .map((a) => `${materialNoun(a.material)} at about ${Math.round(a.item_kg!)} kg (${Math.round(kgToLb(a.item_kg!))} lb) each`)
    .join("; ");
  return {
    kind: "lifting",
    message: `Heavy to lift: ${items}. That is over the ${NIOSH_LIFT_LIMIT_KG} kg (${NIOSH_LIFT_LIMIT_LB} lb) NIOSH recommends for one lift in ideal conditions. Bring a second person, keep the load close, bend your knees, or split it.`,
    listing_ids: heavy.map((a) => a.listing_id),
  };
}

export function buildPlan(
  needs: readonly Need[],
  candidates: readonly CandidateListing[],
  origin: LatLng,
  result: AllocationResult,
  costs: CostOptions,
  vehicle: Vehicle,
): MatchPlan {
  const allocations: Allocation[] = result.picks.map(({ option, units }) => {
    const c = candidates[option.cand];
    const content = unitContent(c)!;
    const need = needs[option.need];
    // In the listing's own unit: a pack listing's option counts packs of `step` kg.
    const listingUnits = units * option.step;
    return {
      listing_id: c.id,
      material: c.material,
      quantity: roundTo(units * option.yield, 3),
      unit: need.unit,
      listing_quantity: roundTo(listingUnits, c.pack ? 3 : 2),
      listing_unit: c.unit,
      packs: c.pack ? units : null,
      distance_km: roundTo(c.distance_km, 3),
      cost_cents: Math.round(units * option.price),
      currency: c.currency,
      load_l: roundTo(listingUnits * content.volume_l, 1),
      load_kg: roundTo(listingUnits * content.kg, 1),
      // A pack is light; only sheets, bags and bales are single items worth weighing.
      item_kg: option.whole && !c.pack ? roundTo(content.kg, 1) : null,
      fulfilment: c.posted ? ("post" as const) : ("pickup" as const),
    };
  });
  // A parcel is no stop: the route, the carloads and the stop count leave it out.
  const onRoute = result.picks.map((_, i) => allocations[i].fulfilment === "pickup");
  const unmet = needs
    .map((n, i) => ({ material: n.material, quantity: roundTo(n.quantity - result.covered[i], 3), unit: n.unit }))
    .filter((u) => u.quantity > UNMET_TOLERANCE);
  const routed = result.picks.filter((_, i) => onRoute[i]);
  const stops = routed.map(({ option }, i) => ({ order: i + 1, listing_id: candidates[option.cand].id, location: candidates[option.cand].location }));
  const split = splitTrips(
    origin,
    routed.map(({ option, units }, i) => {
      const c = candidates[option.cand];
      const content = unitContent(c)!;
      return { listing_id: c.id, location: stops[i].location, units: units * option.step, whole: option.whole && !c.pack, unit_l: content.volume_l, unit_kg: content.kg };
    }),
    vehicle,
  );

  const cautions: Caution[] = [];
  const lifting = liftingCaution(allocations.filter((a) => a.item_kg !== null && a.item_kg > NIOSH_LIFT_LIMIT_KG));
  if (lifting) cautions.push(lifting);
  if (split.oversize.length) {
    cautions.push({
      kind: "oversize",
      message: `A single item is bigger or heavier than the vehicle takes (${vehicle.load_l} L, ${vehicle.load_kg} kg). Borrow a bigger car or a trailer, or ask the supplier about delivery.`,
      listing_ids: split.oversize,
    });
  }
  cautions.push(...materialCautions(new Set(allocations.map((a) => a.material))));

  const price = allocations.reduce((s, a) => s + a.cost_cents, 0);
  // The driving actually done: several carloads drive more than one loop.
  const travel = Math.round(costs.cost_per_km_cents * split.distance_km);
  const stopCents = Math.round(costs.cost_per_stop_cents * Math.max(0, stops.length - 1));
  return {
    needs: needs.map((n) => ({ ...n, quantity: roundTo(n.quantity, 3) })),
    allocations,
    unmet,
    stops,
    total_distance_km: roundTo(result.tour_km, 3),
    driving_distance_km: split.distance_km,
    trips: split.trips,
    totals: {
      price_cents: price,
      travel_cents: travel,
      stop_cents: stopCents,
      cost_cents: price + travel + stopCents,
      currency: allocations[0]?.currency ?? "eur",
      stops: stops.length,
      parcels: allocations.length - stops.length,
      trips: split.trips.length,
    },
    cautions,
  };
}

/** Plan pickups for `needs` from `candidates` (each with its distance from `origin`). */
export function matchPlan(needs: readonly Need[], candidates: readonly CandidateListing[], origin: LatLng, opts: PlanOptions = {}): MatchPlan {
  const merged = mergeNeeds(needs);
  const costs = resolveCosts(opts.costs);
  const vehicle = { ...DEFAULT_VEHICLE, ...Object.fromEntries(Object.entries(opts.vehicle ?? {}).filter(([, v]) => v !== undefined)) } as Vehicle;
  const result = allocate(merged, candidates, origin, costs, opts.warm);
  return buildPlan(merged, candidates, origin, result, costs, vehicle);
}
