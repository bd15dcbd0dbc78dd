import { WORM_STOCKING_KG_PER_M2, WORMS_PER_KG } from "./facts";
import { assertNonNegativeFinite } from "./numbers";

/** Worms to seed a bed, by weight (as they are sold) and as a rough head count. */
export function wormsFor(area_m2: number, kg_per_m2: number = WORM_STOCKING_KG_PER_M2): { kg: number; count: number } {
  assertNonNegativeFinite("area_m2", area_m2);
  assertNonNegativeFinite("kg_per_m2", kg_per_m2);
  const kg = area_m2 * kg_per_m2;
  return { kg, count: Math.round(kg * WORMS_PER_KG) };
}
