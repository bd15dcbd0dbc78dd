import { WORM_STOCKING_KG_PER_M2, WORMS_PER_KG } from "./facts";

/** Worms to seed a bed, by weight (as they are sold) and as a rough head count. */
export function wormsFor(area_m2: number, kg_per_m2: number = WORM_STOCKING_KG_PER_M2): { kg: number; count: number } {
  if (!(area_m2 >= 0 && Number.isFinite(area_m2)) || !(kg_per_m2 >= 0 && Number.isFinite(kg_per_m2))) {
    throw new RangeError("area_m2 and kg_per_m2 must be non-negative and finite");
  }
  const kg = area_m2 * kg_per_m2;
  return { kg, count: Math.round(kg * WORMS_PER_KG) };
}
