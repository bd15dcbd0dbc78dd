// How much one unit of a material is: its mass, the ground or volume it covers on a bed,
import type { ListingUnit } from "./units";
// and the room it takes when handed over. The one answer to "how many kg is N of this unit
// of this material": the estimate, matching, the diversion reports and the listing pages
// all ask here, so a cubic metre of leaves weighs the same on every screen.
import {
  BAG_M3,
  BALE_M3,
  CARDBOARD_KG_PER_M2,
  CARDBOARD_THICKNESS_M,
  DEFAULT_CARDBOARD_SHEET,
  MATERIALS,
  type MaterialCode,
} from "./facts";
import { assertNonNegativeFinite } from "./numbers";

/** Every unit a quantity of material is counted in, by a listing, a need or a giveaway day. */

/** What a supplier says of one sheet, bag or bale; either may be unknown. */
export interface UnitSize {
  /** m² a sheet, m³ a bag or bale. */
  unit_size?: number | null;
  /** kg a bag or bale. */
  unit_mass_kg?: number | null;
}

export interface UnitAmount {
  kg: number;
  /** m³ it fills once spread on a bed; null for board and worms. */
  spread_m3: number | null;
  /** m² of cardboard it lays; null for everything but board. */
  area_m2: number | null;
  /** m³ it takes up as handed over (in the car, in a waste audit). */
  handed_m3: number;
}

const DEFAULT_SHEET_M2 = DEFAULT_CARDBOARD_SHEET.length_m * DEFAULT_CARDBOARD_SHEET.width_m;
const given = (x: number | null | undefined): x is number => typeof x === "number" && Number.isFinite(x) && x > 0;

function board(unit: ListingUnit, size: UnitSize): UnitAmount | null {
  const flat = (area: number): UnitAmount => ({ kg: area * CARDBOARD_KG_PER_M2, spread_m3: null, area_m2: area, handed_m3: area * CARDBOARD_THICKNESS_M });
  switch (unit) {
    case "sheets":
      return flat(given(size.unit_size) ? size.unit_size : DEFAULT_SHEET_M2);
    case "m2":
      return flat(1);
    case "kg":
      return flat(1 / CARDBOARD_KG_PER_M2);
    default: {
      // Loose or baled board: its weight says how much ground it would lay.
      const m3 = unit === "m3" ? 1 : given(size.unit_size) ? size.unit_size : unit === "bags" ? BAG_M3 : BALE_M3;
      const kg = unit !== "m3" && given(size.unit_mass_kg) ? size.unit_mass_kg : m3 * MATERIALS.cardboard.bulk_density_kg_m3;
      return { kg, spread_m3: null, area_m2: kg / CARDBOARD_KG_PER_M2, handed_m3: m3 };
    }
  }
}

function loose(material: MaterialCode, unit: ListingUnit, size: UnitSize): UnitAmount | null {
  const facts = MATERIALS[material];
  const density = facts.bulk_density_kg_m3;
  const volume = (m3: number, kg?: number | null): UnitAmount => ({ kg: given(kg) ? kg : m3 * density, spread_m3: m3, area_m2: null, handed_m3: m3 });
  switch (unit) {
    case "m3":
      return volume(1);
    case "kg":
      return { kg: 1, spread_m3: 1 / density, area_m2: null, handed_m3: 1 / density };
    case "bags":
      return volume(given(size.unit_size) ? size.unit_size : BAG_M3, size.unit_mass_kg);
    case "bales": {
      if (facts.bale_expansion) {
        // Baled and spread: compressed in the bale, loosened on the bed.
        const m3 = given(size.unit_size) ? size.unit_size : BALE_M3;
        const spread = m3 * facts.bale_expansion;
        return { kg: given(size.unit_mass_kg) ? size.unit_mass_kg : spread * density, spread_m3: spread, area_m2: null, handed_m3: m3 };
      }
      // Leaves or chips tied into bales say how big they are; no straw bale to assume.
      return given(size.unit_size) ? volume(size.unit_size, size.unit_mass_kg) : null;
    }
    default:
      return null; // a sheet or a square metre of leaves is not a thing
  }
}

/** One unit of `material` counted in `unit`, or null when that unit makes no sense for it. */
export function unitAmount(material: MaterialCode, unit: ListingUnit, size: UnitSize = {}): UnitAmount | null {
  if (!(material in MATERIALS)) return null;
  if (material === "cardboard") return board(unit, size);
  if (material === "worms") {
    // Live cultures are sold by weight; bedding and all, about as dense as water (from memory).
    return unit === "kg" ? { kg: 1, spread_m3: null, area_m2: null, handed_m3: 1 / MATERIALS.worms.bulk_density_kg_m3 } : null;
  }
  return loose(material, unit, size);
}

function amountOrThrow(material: MaterialCode, unit: ListingUnit, size: UnitSize): UnitAmount {
  const a = unitAmount(material, unit, size);
  if (!a) {
    throw new RangeError(
      unit === "bales" ? `a bale of ${material} must state its volume` : `${material} is not counted in ${unit}`,
    );
  }
  return a;
}

/** kg in `quantity` of `unit` of `material`. */
export function massOf(material: MaterialCode, quantity: number, unit: ListingUnit, size: UnitSize = {}): number {
  assertNonNegativeFinite("quantity", quantity);
  return quantity * amountOrThrow(material, unit, size).kg;
}

/** m³ as handed over in `quantity` of `unit` of `material`. */
export function handedVolumeOf(material: MaterialCode, quantity: number, unit: ListingUnit, size: UnitSize = {}): number {
  assertNonNegativeFinite("quantity", quantity);
  return quantity * amountOrThrow(material, unit, size).handed_m3;
}
