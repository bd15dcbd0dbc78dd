import { BAG_M3, BALE_EXPANSION_FACTOR, BALE_M3 } from "./facts";
import { assertNonNegativeFinite, ceilWhole } from "./numbers";

/** m³ of a layer `depth_cm` deep over `area_m2`. */
export function layerVolume(area_m2: number, depth_cm: number): number {
  assertNonNegativeFinite("area_m2", area_m2);
  assertNonNegativeFinite("depth_cm", depth_cm);
  return (area_m2 * depth_cm) / 100;
}
/** Bags of `bag_m3` needed to hold `m3`. */
export function bagsFor(m3: number, bag_m3: number = BAG_M3): number {
  assertNonNegativeFinite("m3", m3);
  if (!(bag_m3 > 0)) throw new RangeError("bag_m3 must be positive");
  return ceilWhole(m3 / bag_m3);
}

/** Bales needed to spread `m3_spread` on a bed: each bale covers bale_m3 × expansion once loosened. */
export function balesFor(
  m3_spread: number,
  bale_m3: number = BALE_M3,
  expansion: number = BALE_EXPANSION_FACTOR,
): number {
  assertNonNegativeFinite("m3_spread", m3_spread);
  if (!(bale_m3 > 0) || !(expansion >= 1)) throw new RangeError("bale_m3 must be positive and expansion at least 1");
  return ceilWhole(m3_spread / (bale_m3 * expansion));
}
