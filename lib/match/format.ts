import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { MAX_RADIUS_KM } from "./defaults";

/** A material's name inside a sentence: "composting worms (Eisenia fetida)", species kept as written. */
export function materialNoun(code: MaterialCode): string {
  const name = MATERIALS[code].name;
  return name[0].toLowerCase() + name.slice(1);
}

/** How far a plan may look, in the reader's unit: "Up to 100 km." / "Up to 62 mi." */
export const radiusHint = (system: UnitSystem) => `Up to ${formatQuantity(MAX_RADIUS_KM, "km", system)}.`;

/** A radius the schema refused, told in the reader's unit (the schema itself speaks the API's km). */
export const radiusProblem = (system: UnitSystem) => `Choose a distance more than 0 and up to ${formatQuantity(MAX_RADIUS_KM, "km", system)}.`;
