// How a gardener says how much they need, in their own units, and how a need is read back.
// Needs are stored in SI (m², m³ or kg, as lib/match measures them); a loose material can also
// be asked for in paper lawn-and-leaf bags, the way people count leaves. Every factor comes
// from lib/calc (BAG_M3, the NIST unit definitions), none is typed here.
import { BAG_M3, LITRE_M3, type MaterialCode } from "@/lib/calc/facts";
import { ft2ToM2, ft3ToM3, kgToLb, lbToKg, m2ToFt2, m3ToFt3, m3ToYd3, yd3ToM3, type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { NEED_UNITS } from "@/lib/match/units";
import type { NeedUnit } from "@/lib/match/types";

/** Every unit a need may be given in, to the API or on the form; stored as its `si` unit. */
export const NEED_INPUT_UNITS = ["m2", "ft2", "m3", "yd3", "ft3", "l", "bags", "kg", "lb"] as const;
export type NeedInputUnit = (typeof NEED_INPUT_UNITS)[number];

export interface NeedInputOption {
  code: NeedInputUnit;
  label: string;
  /** The SI unit it is stored in. */
  si: NeedUnit;
}

const OPTIONS: Record<NeedInputUnit, NeedInputOption> = {
  m2: { code: "m2", label: "m²", si: "m2" },
  ft2: { code: "ft2", label: "ft²", si: "m2" },
  m3: { code: "m3", label: "m³", si: "m3" },
  yd3: { code: "yd3", label: "yd³", si: "m3" },
  ft3: { code: "ft3", label: "ft³", si: "m3" },
  l: { code: "l", label: "L", si: "m3" },
  bags: { code: "bags", label: "bags", si: "m3" },
  kg: { code: "kg", label: "kg", si: "kg" },
  lb: { code: "lb", label: "lb", si: "kg" },
};

/** What a bag is, for the form's hint: the paper lawn-and-leaf sack BAG_M3 stands for. */
export const BAG_WORDS = "A bag is a 30 US gal (114 L) paper leaf sack.";

/** Loose materials are counted in bags too; cardboard by area, worms and grounds by weight. */
const BAGGED = new Set<MaterialCode>(["leaves", "straw", "grass_clippings", "wood_chips", "manure", "compost"]);

/** The units the form offers for a material, in the reader's system, most natural first. */
export function needInputUnits(material: MaterialCode, system: UnitSystem): NeedInputOption[] {
  const out: NeedInputOption[] = [];
  for (const si of NEED_UNITS[material]) {
    if (si === "m3" && BAGGED.has(material)) out.push(OPTIONS.bags);
    if (si === "m3") out.push(system === "imperial" ? OPTIONS.yd3 : OPTIONS.m3);
    if (si === "m2") out.push(system === "imperial" ? OPTIONS.ft2 : OPTIONS.m2);
    if (si === "kg") out.push(system === "imperial" ? OPTIONS.lb : OPTIONS.kg);
  }
  return out;
}

/** The SI unit an input unit is stored in. */
export const siUnitOf = (unit: NeedInputUnit): NeedUnit => OPTIONS[unit].si;

const TO_SI: Record<NeedInputUnit, (x: number) => number> = {
  m2: (x) => x,
  ft2: ft2ToM2,
  m3: (x) => x,
  yd3: yd3ToM3,
  ft3: ft3ToM3,
  l: (x) => x * LITRE_M3,
  bags: (x) => x * BAG_M3,
  kg: (x) => x,
  lb: lbToKg,
};

/** A typed amount in an input unit, as it is stored (SI). */
export function toSiNeed(amount: number, unit: NeedInputUnit): { quantity: number; unit: NeedUnit } {
  return { quantity: TO_SI[unit](amount), unit: OPTIONS[unit].si };
}

/** An SI amount in an input unit (to fill the form with a bed's unmet need). */
export function fromSiNeed(quantity: number, unit: NeedInputUnit): number {
  switch (unit) {
    case "ft2":
      return m2ToFt2(quantity);
    case "yd3":
      return m3ToYd3(quantity);
    case "ft3":
      return m3ToFt3(quantity);
    case "l":
      return quantity / LITRE_M3;
    case "bags":
      return quantity / BAG_M3;
    case "lb":
      return kgToLb(quantity);
    default:
      return quantity;
  }
}

/** "0.45 m³ (about 4 bags)": the measure in the reader's units, and bags for loose volumes. */
export function formatNeedQuantity(quantity: number, unit: NeedUnit, material: MaterialCode, system: UnitSystem): string {
  const measure = formatQuantity(quantity, unit, system);
  if (unit !== "m3" || !BAGGED.has(material) || quantity <= 0) return measure;
  const bags = Math.max(1, Math.round(quantity / BAG_M3));
  return `${measure} (about ${bags} ${bags === 1 ? "bag" : "bags"})`;
}
