// What one listing unit holds, in each of the units a need can be measured in. All the
// factors come from lib/calc: sheet areas, bag and bale volumes, the bale expansion factor,
// bulk densities and cardboard's areal mass.
import {
  BAG_M3,
  BALE_EXPANSION_FACTOR,
  BALE_M3,
  CARDBOARD_KG_PER_M2,
  CARDBOARD_THICKNESS_M,
  DEFAULT_CARDBOARD_SHEET,
  LITRE_M3,
  MATERIALS,
  type MaterialCode,
} from "@/lib/calc/facts";
import { massFromVolume } from "@/lib/calc/layers";
import type { ListingUnit, NeedUnit } from "./types";

/**
 * The units a need may be given in. Cardboard covers an area (or weighs so much), worms are
 * only ever sold by weight, everything else is a spread volume or a weight.
 */
export const NEED_UNITS: Record<MaterialCode, readonly NeedUnit[]> = {
  cardboard: ["m2", "kg"],
  worms: ["kg"],
  leaves: ["m3", "kg"],
  straw: ["m3", "kg"],
  grass_clippings: ["m3", "kg"],
  coffee_grounds: ["kg", "m3"],
  wood_chips: ["m3", "kg"],
  manure: ["m3", "kg"],
  compost: ["m3", "kg"],
};

export const NEED_UNIT_LABEL: Record<NeedUnit, string> = { m2: "m²", m3: "m³", kg: "kg" };

/** Sheets, bags and bales change hands whole; m², m³ and kg can be measured out. */
export const WHOLE_UNITS: ReadonlySet<ListingUnit> = new Set<ListingUnit>(["sheets", "bags", "bales"]);

/** Loose quantities are measured out to the hundredth of a unit (10 L, 10 g, 0.01 m²). */
export const MEASURE_STEP = 0.01;

export interface UnitContent {
  /** m² of cardboard laid, for cardboard only. */
  area_m2: number | null;
  /** m³ once spread on a bed (a bale loosens to BALE_EXPANSION_FACTOR times its volume). */
  spread_m3: number | null;
  kg: number;
  /** Litres it takes up in the car, as handed over. */
  volume_l: number;
}

export interface ListingShape {
  material: MaterialCode;
  unit: ListingUnit;
  unit_size: number | null;
  unit_mass_kg: number | null;
}

const DEFAULT_SHEET_M2 = DEFAULT_CARDBOARD_SHEET.length_m * DEFAULT_CARDBOARD_SHEET.width_m;
const litres = (m3: number) => m3 / LITRE_M3;
const positive = (x: number | null | undefined): x is number => typeof x === "number" && Number.isFinite(x) && x > 0;

function cardboardContent(l: ListingShape): UnitContent {
  const flat = (area: number): UnitContent => ({
    area_m2: area,
    spread_m3: null,
    kg: area * CARDBOARD_KG_PER_M2,
    volume_l: litres(area * CARDBOARD_THICKNESS_M),
  });
  switch (l.unit) {
    case "sheets":
      return flat(positive(l.unit_size) ? l.unit_size : DEFAULT_SHEET_M2);
    case "m2":
      return flat(1);
    case "kg":
      return flat(1 / CARDBOARD_KG_PER_M2);
    default: {
      // Loose or baled board: its weight says how much area it would lay.
      const m3 = l.unit === "m3" ? 1 : positive(l.unit_size) ? l.unit_size : l.unit === "bags" ? BAG_M3 : BALE_M3;
      const kg = l.unit === "bales" && positive(l.unit_mass_kg) ? l.unit_mass_kg : massFromVolume("cardboard", m3);
      return { area_m2: kg / CARDBOARD_KG_PER_M2, spread_m3: null, kg, volume_l: litres(m3) };
    }
  }
}

function looseContent(l: ListingShape): UnitContent | null {
  const m = l.material;
  const spreadKg = (m3: number) => massFromVolume(m, m3, { spread: true });
  switch (l.unit) {
    case "bags": {
      const m3 = positive(l.unit_size) ? l.unit_size : BAG_M3;
      return { area_m2: null, spread_m3: m3, kg: spreadKg(m3), volume_l: litres(m3) };
    }
    case "m3":
      return { area_m2: null, spread_m3: 1, kg: spreadKg(1), volume_l: litres(1) };
    case "bales": {
      const m3 = positive(l.unit_size) ? l.unit_size : BALE_M3;
      const kg = positive(l.unit_mass_kg) ? l.unit_mass_kg : massFromVolume(m, m3);
      return { area_m2: null, spread_m3: m3 * BALE_EXPANSION_FACTOR, kg, volume_l: litres(m3) };
    }
    case "kg":
      return { area_m2: null, spread_m3: 1 / spreadKg(1), kg: 1, volume_l: litres(1 / MATERIALS[m].bulk_density_kg_m3) };
    default:
      return null; // sheets or m² of leaves: not a thing
  }
}

/** What one unit of a listing holds, or null when the unit makes no sense for the material. */
export function unitContent(l: ListingShape): UnitContent | null {
  if (l.material === "cardboard") return cardboardContent(l);
  if (l.material === "worms") {
    return l.unit === "kg" ? { area_m2: null, spread_m3: null, kg: 1, volume_l: litres(1 / MATERIALS.worms.bulk_density_kg_m3) } : null;
  }
  return looseContent(l);
}

/** How much of a need (in `unit`) one listing unit covers; null when they cannot be compared. */
export function needPerListingUnit(l: ListingShape, unit: NeedUnit): number | null {
  const c = unitContent(l);
  if (!c) return null;
  const v = unit === "m2" ? c.area_m2 : unit === "m3" ? c.spread_m3 : c.kg;
  return positive(v) ? v : null;
}

/** kg in one need unit, so two needs for the same material in different units can be added. */
function kgPerNeedUnit(material: MaterialCode, unit: NeedUnit): number {
  if (unit === "kg") return 1;
  if (unit === "m2") return CARDBOARD_KG_PER_M2;
  return massFromVolume(material, 1, { spread: true });
}

export function isNeedUnitFor(material: MaterialCode, unit: NeedUnit): boolean {
  return NEED_UNITS[material].includes(unit);
}

export function convertNeed(material: MaterialCode, quantity: number, from: NeedUnit, to: NeedUnit): number {
  if (from === to) return quantity;
  if (!isNeedUnitFor(material, from) || !isNeedUnitFor(material, to)) {
    throw new RangeError(`${material} cannot be converted from ${from} to ${to}`);
  }
  return (quantity * kgPerNeedUnit(material, from)) / kgPerNeedUnit(material, to);
}
