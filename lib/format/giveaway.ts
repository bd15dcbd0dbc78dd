import type { UnitSystem } from "@/lib/calc/units";
import { formatListingQuantity } from "@/lib/listings/format";

/** "3 bags", "1 bag", "0.5 m³" (or "17.7 ft³" for an imperial reader): a giveaway day's quantity, read as a listing's. */
export function formatGiveawayQuantity(quantity: number, unit: "bags" | "m3", system: UnitSystem = "metric"): string {
  return formatListingQuantity(quantity, unit, system);
}

/** A quantity the reader types in the day's own unit: theirs first, the one they type after ("17.7 ft³ (0.5 m³)"). */
export function formatTypedGiveawayQuantity(quantity: number, unit: "bags" | "m3", system: UnitSystem): string {
  const own = formatGiveawayQuantity(quantity, unit);
  return unit === "m3" && system === "imperial" ? `${formatGiveawayQuantity(quantity, unit, system)} (${own})` : own;
}
