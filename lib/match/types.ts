import type { ListingUnit, NeedUnit } from "@/lib/calc/units";
import type { MaterialCode } from "@/lib/calc/facts";
import type { Pack } from "@/lib/listings/packs";

export interface LatLng {
  lat: number;
  lng: number;
}

export type { ListingUnit, NeedUnit };

export interface Need {
  material: MaterialCode;
  quantity: number;
  unit: NeedUnit;
}

/** A listing as matching sees it: its public point, what is left, and its price. */
export interface CandidateListing {
  id: string;
  material: MaterialCode;
  unit: ListingUnit;
  /** m² a sheet, m³ a bag or bale; null for m2, m3 and kg listings (and taken as the default size for the others). */
  unit_size: number | null;
  /** kg a bale, when the supplier says. */
  unit_mass_kg: number | null;
  /** Listing units still free to reserve: total − held − collected. */
  available: number;
  max_per_reservation: number | null;
  /** Per listing unit. */
  price_cents: number;
  /** Sold by the pack (a live culture): it gives whole packs of `size` listing units at `price_cents` each. */
  pack?: Pack | null;
  currency: string;
  /** The approximate public point, never the exact one. */
  location: LatLng;
  /** Great-circle distance from the origin to `location`. */
  distance_km: number;
  /**
   * Sent by post (a live culture its grower only posts): no stop on the route, so it is
   * planned at the origin, `location` the origin and `distance_km` 0.
   */
  posted?: boolean;
}

export interface Allocation {
  listing_id: string;
  material: MaterialCode;
  /** What this pickup gives, in the need's unit (whole units can give a little more than asked). */
  quantity: number;
  unit: NeedUnit;
  /** What to reserve, in the listing's unit. */
  listing_quantity: number;
  listing_unit: ListingUnit;
  /** For a listing sold by the pack: how many whole packs listing_quantity is; null otherwise. */
  packs: number | null;
  distance_km: number;
  /** Price of this pickup: price_cents × listing_quantity, or packs × the pack price. */
  cost_cents: number;
  currency: string;
  load_l: number;
  load_kg: number;
  /** kg of one sheet, bag or bale; null for loose material. */
  item_kg: number | null;
  /** "post": it comes as a parcel, not from a stop on the route. */
  fulfilment: "pickup" | "post";
}

export interface Stop {
  order: number;
  listing_id: string;
  location: LatLng;
}

export interface Trip {
  stops: string[];
  load_l: number;
  load_kg: number;
  distance_km: number;
}

export interface Caution {
  kind: "lifting" | "oversize" | "material";
  message: string;
  listing_ids?: string[];
}

export interface PlanTotals {
  price_cents: number;
  travel_cents: number;
  stop_cents: number;
  /** What the plan minimises: price + travel + stops. */
  cost_cents: number;
  currency: string;
  stops: number;
  /** Allocations that come by post. */
  parcels: number;
  trips: number;
}

export interface MatchPlan {
  needs: Need[];
  allocations: Allocation[];
  unmet: Need[];
  /** The pickups in visiting order; posted allocations are parcels, not stops. */
  stops: Stop[];
  /** The visiting loop through `stops` from the origin and back, km. */
  total_distance_km: number;
  /** The distance actually driven when the load takes several trips, km. */
  driving_distance_km: number;
  trips: Trip[];
  totals: PlanTotals;
  cautions: Caution[];
}
