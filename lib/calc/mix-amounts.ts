// The mix tool takes amounts the way people have them (a few buckets of grounds, two barrows
// of leaves, a bale of straw) and turns each into kg as is, which is all the blend needs.
import { BARROW_M3, BUCKET_M3, type MaterialCode } from "./facts";
import { unitAmount } from "./mass";

export type MixUnit = "kg" | "buckets" | "barrows" | "bags" | "bales";
export const MIX_UNITS: readonly MixUnit[] = ["buckets", "barrows", "bags", "bales", "kg"];

const VOLUME_M3: Partial<Record<MixUnit, number>> = { buckets: BUCKET_M3, barrows: BARROW_M3 };

/** kg in one `unit` of `material` as it usually comes; null when the unit does not fit it (a bale of grounds). */
export function mixUnitKg(material: MaterialCode | undefined, unit: MixUnit): number | null {
  if (unit === "kg") return 1;
  if (!material || material === "worms") return null;
  const volume = VOLUME_M3[unit];
  if (volume !== undefined) {
    const perM3 = unitAmount(material, "m3");
    return perM3 ? perM3.kg * volume : null;
  }
  return unitAmount(material, unit as "bags" | "bales")?.kg ?? null;
}

/** The units that make sense for a material in the mix tool. */
export function mixUnitsFor(material: MaterialCode | undefined): MixUnit[] {
  return MIX_UNITS.filter((u) => mixUnitKg(material, u) !== null);
}
