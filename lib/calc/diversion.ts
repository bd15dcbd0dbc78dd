import { BAG_M3, BALE_M3, CARDBOARD_KG_PER_M2, DEFAULT_CARDBOARD_SHEET, type MaterialCode } from "./facts";
import { massFromVolume } from "./layers";
import { assertNonNegativeFinite, assertPositiveFinite } from "./numbers";

export type DiversionUnit = "m2" | "m3" | "kg" | "sheets" | "bags" | "bales";

/**
 * Kilograms of material put to use in a bed instead of going to landfill or a burn pile.
 * `unitSize` is the size of one unit where the unit is countable: m² per sheet, m³ per bag
 * or m³ per bale (defaults: DEFAULT_CARDBOARD_SHEET, BAG_M3, BALE_M3). Bag and bale volumes
 * are as handed over — a bale is weighed compressed, not spread.
 */
export function divertedKg(material: MaterialCode, quantity: number, unit: DiversionUnit, unitSize?: number): number {
  assertNonNegativeFinite("quantity", quantity);
  if (unitSize !== undefined) assertPositiveFinite("unitSize", unitSize);
  switch (unit) {
    case "kg":
      return quantity;
    case "m3":
      return massFromVolume(material, quantity);
    case "bags":
      return massFromVolume(material, quantity * (unitSize ?? BAG_M3));
    case "bales":
      return massFromVolume(material, quantity * (unitSize ?? BALE_M3));
    case "m2":
    case "sheets": {
      // Only board is counted by area; a square metre of leaves has no weight until it has a depth.
      if (material !== "cardboard") throw new RangeError(`${material} is measured by volume or weight, not by area`);
      const sheet_m2 = unitSize ?? DEFAULT_CARDBOARD_SHEET.length_m * DEFAULT_CARDBOARD_SHEET.width_m;
      return (unit === "m2" ? quantity : quantity * sheet_m2) * CARDBOARD_KG_PER_M2;
    }
  }
}
