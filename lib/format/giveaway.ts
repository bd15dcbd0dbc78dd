import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";

/** "3 bags", "1 bag", "0.5 m³" (or "17.7 ft³" for an imperial reader): a giveaway day's quantity. */
export function formatGiveawayQuantity(quantity: number, unit: "bags" | "m3", system: UnitSystem = "metric"): string {
  const n = Number(quantity.toFixed(2));
  if (unit === "m3") return system === "imperial" ? formatQuantity(quantity, "m3", system) : `${n} m³`;
  return `${n} ${n === 1 ? "bag" : "bags"}`;
}

/** A quantity the reader types in the day's own unit: theirs first, the one they type after ("17.7 ft³ (0.5 m³)"). */
export function formatTypedGiveawayQuantity(quantity: number, unit: "bags" | "m3", system: UnitSystem): string {
  const own = formatGiveawayQuantity(quantity, unit);
  return unit === "m3" && system === "imperial" ? `${formatGiveawayQuantity(quantity, unit, system)} (${own})` : own;
}
