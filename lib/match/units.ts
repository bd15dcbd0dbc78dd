// What one listing unit holds, in each of the units a need can be measured in: the one mass
// function of lib/calc/mass.ts, seen the way matching needs it.
import { LITRE_M3, type MaterialCode } from "@/lib/calc/facts";
import { unitAmount } from "@/lib/calc/mass";
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


/** Loose quantities are measured out to the hundredth of a unit (10 L, 10 g, 0.01 m²). */
export const MEASURE_STEP = 0.01;

export interface UnitContent {
  /** m² of cardboard laid, for cardboard only. */
  area_m2: number | null;
  /** m³ once spread on a bed (a straw bale loosens to BALE_EXPANSION_FACTOR times its volume). */
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

/** What one unit of a listing holds, or null when the unit makes no sense for the material. */
export function unitContent(l: ListingShape): UnitContent | null {
  const a = unitAmount(l.material, l.unit, l);
  return a ? { area_m2: a.area_m2, spread_m3: a.spread_m3, kg: a.kg, volume_l: a.handed_m3 / LITRE_M3 } : null;
}

const positive = (x: number | null | undefined): x is number => typeof x === "number" && Number.isFinite(x) && x > 0;

/** How much of a need (in `unit`) one listing unit covers; null when they cannot be compared. */
export function needPerListingUnit(l: ListingShape, unit: NeedUnit): number | null {
  const c = unitContent(l);
  if (!c) return null;
  const v = unit === "m2" ? c.area_m2 : unit === "m3" ? c.spread_m3 : c.kg;
  return positive(v) ? v : null;
}

/** kg in one need unit, so two needs for the same material in different units can be added. */
function kgPerNeedUnit(material: MaterialCode, unit: NeedUnit): number {
  return unitAmount(material, unit)!.kg;
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
