import type { EstimateResult } from "@/lib/calc/estimate";
import type { Need } from "@/lib/match/types";
import { ApiError } from "@/lib/api/errors";
import { bedEstimate, toBedView } from "@/lib/beds/view";
import type { BedRow } from "@/db/beds";

/** The needs an estimate's layers make, as matching takes them. */
export function needsOf(result: EstimateResult): Need[] {
  return result.needs.map((n) => ({ material: n.material, quantity: n.quantity, unit: n.unit })).filter((n) => n.quantity > 0);
}

/** What a saved bed needs: its own estimate (the bed page's), as needs. */
export function bedNeeds(row: BedRow): Need[] {
  let estimate: EstimateResult;
  try {
    estimate = bedEstimate(toBedView(row));
  } catch {
    // A row written before a rule changed, or by hand: say so rather than fail.
    throw new ApiError("invalid_state", "This bed's saved size or layers cannot be read. Open the bed, check it and save it again.");
  }
  return needsOf(estimate);
}
