import type { PickupWindowRow } from "@/db/types";
import type { PickupWindowInput } from "@/lib/validation/listings";

/** A pickup window as the form sends it, in the columns it is stored in (instants in UTC ISO). */
export function pickupWindowFields(w: PickupWindowInput): Omit<PickupWindowRow, "id" | "listing_id"> {
  return w.kind === "weekly"
    ? { kind: "weekly", weekday: w.weekday, start_time: w.start_time, end_time: w.end_time, starts_at: null, ends_at: null }
    : { kind: "dated", weekday: null, start_time: null, end_time: null, starts_at: new Date(w.starts_at).toISOString(), ends_at: new Date(w.ends_at).toISOString() };
}
