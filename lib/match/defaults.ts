// The prices a pickup plan puts on driving and on stopping. They are product choices, not
// facts: named here so a caller can see and override each one.
import { SMALL_CAR_LOAD } from "@/lib/calc/facts";

/**
 * What a kilometre of driving costs the gardener, in cents. About what running a small car
 * costs; UK HMRC's approved mileage rate of 45p a mile is 28p a km (from memory).
 */
export const DEFAULT_COST_PER_KM_CENTS = 30;

/**
 * What each stop after the first costs, in cents: parking, finding the door, loading, a
 * chat. A euro makes one stop beat two when the second saves under about 3 km of driving
 * (common practice, no source: a product choice).
 */
export const DEFAULT_COST_PER_STOP_CENTS = 100;

/** A small car (facts.ts SMALL_CAR_LOAD). */
export const DEFAULT_VEHICLE = SMALL_CAR_LOAD;

/** Default search radius, km, and the largest one accepted (a product limit: a day's drive out and back). */
export const DEFAULT_RADIUS_KM = 15;
export const MAX_RADIUS_KM = 200;
/** The most needs one request may carry (a product limit; a bed has five or six). */
export const MAX_NEEDS = 20;

export interface CostOptions {
  cost_per_km_cents: number;
  cost_per_stop_cents: number;
}

export const DEFAULT_COSTS: CostOptions = {
  cost_per_km_cents: DEFAULT_COST_PER_KM_CENTS,
  cost_per_stop_cents: DEFAULT_COST_PER_STOP_CENTS,
};
