import { MATERIALS, type MaterialCode } from "./facts";
import { handedVolumeOf, massOf } from "./mass";
import type { ListingUnit } from "./units";
import { assertPositiveFinite } from "./numbers";


/**
 * Kilograms of material put to use in a bed instead of going to landfill or a burn pile,
 * through the one mass function (lib/calc/mass.ts). `unitSize` is the size of one countable
 * unit: m² per sheet, m³ per bag or bale; `unitMassKg` a bag's or bale's stated weight.
 */
export function divertedKg(material: MaterialCode, quantity: number, unit: ListingUnit, unitSize?: number, unitMassKg?: number): number {
  if (unitSize !== undefined) assertPositiveFinite("unitSize", unitSize);
  return massOf(material, quantity, unit, { unit_size: unitSize, unit_mass_kg: unitMassKg });
}

/**
 * m³ of material as handed over: volumes pass through (bags and bales by their stated or
 * default size); what is counted by weight or area becomes a loose volume through the
 * material's bulk density, the way waste audits convert weight to volume.
 */
export function divertedM3(material: MaterialCode, quantity: number, unit: ListingUnit, unitSize?: number, unitMassKg?: number): number {
  if (unitSize !== undefined) assertPositiveFinite("unitSize", unitSize);
  if (unit === "kg" || unit === "m2" || unit === "sheets") return massOf(material, quantity, unit, { unit_size: unitSize }) / MATERIALS[material].bulk_density_kg_m3;
  return handedVolumeOf(material, quantity, unit, { unit_size: unitSize, unit_mass_kg: unitMassKg });
}

/** One hand-over: a collected reservation or a household checked in at a giveaway day. */
export interface DiversionRecord {
  material: MaterialCode;
  quantity: number;
  unit: ListingUnit;
  unitSize?: number;
  /** A bag's or bale's stated weight, kg. */
  unitMassKg?: number;
  /** YYYY-MM the material left. */
  month: string;
  /** Who took it (an account stands for a household). */
  household: string;
  /** A giveaway day, when it came from one. */
  day?: { id: string; date: string; title: string };
}

export interface DiversionSummary {
  total_kg: number;
  total_m3: number;
  households: number;
  collections: number;
  by_month: { month: string; material: MaterialCode; kg: number; m3: number; households: number; collections: number }[];
  by_material: { material: MaterialCode; kg: number; m3: number }[];
  by_day: { day_id: string; date: string; title: string; material: MaterialCode; kg: number; m3: number; households: number }[];
}

const round = (x: number, places: number) => Math.round(x * 10 ** places) / 10 ** places;

/** Sums hand-overs by month and material (and by giveaway day), masses through divertedKg. */
export function summariseDiversion(records: DiversionRecord[]): DiversionSummary {
  type Bucket = { kg: number; m3: number; households: Set<string>; collections: number };
  const bucket = (): Bucket => ({ kg: 0, m3: 0, households: new Set(), collections: 0 });
  const months = new Map<string, Bucket & { month: string; material: MaterialCode }>();
  const materials = new Map<MaterialCode, Bucket>();
  const days = new Map<string, Bucket & { date: string; title: string; material: MaterialCode }>();
  const all = bucket();
  for (const r of records) {
    const kg = divertedKg(r.material, r.quantity, r.unit, r.unitSize ?? undefined, r.unitMassKg ?? undefined);
    const m3 = divertedM3(r.material, r.quantity, r.unit, r.unitSize ?? undefined, r.unitMassKg ?? undefined);
    const key = `${r.month}|${r.material}`;
    if (!months.has(key)) months.set(key, { ...bucket(), month: r.month, material: r.material });
    if (!materials.has(r.material)) materials.set(r.material, bucket());
    const targets: Bucket[] = [all, months.get(key)!, materials.get(r.material)!];
    if (r.day) {
      if (!days.has(r.day.id)) days.set(r.day.id, { ...bucket(), date: r.day.date, title: r.day.title, material: r.material });
      targets.push(days.get(r.day.id)!);
    }
    for (const b of targets) {
      b.kg += kg;
      b.m3 += m3;
      b.households.add(r.household);
      b.collections += 1;
    }
  }
  return {
    total_kg: round(all.kg, 3),
    total_m3: round(all.m3, 4),
    households: all.households.size,
    collections: all.collections,
    by_month: [...months.values()]
      .sort((a, b) => a.month.localeCompare(b.month) || a.material.localeCompare(b.material))
      .map((b) => ({ month: b.month, material: b.material, kg: round(b.kg, 3), m3: round(b.m3, 4), households: b.households.size, collections: b.collections })),
    by_material: [...materials.entries()].sort((a, b) => b[1].kg - a[1].kg).map(([material, b]) => ({ material, kg: round(b.kg, 3), m3: round(b.m3, 4) })),
    by_day: [...days.entries()]
      .sort((a, b) => b[1].date.localeCompare(a[1].date))
      .map(([day_id, b]) => ({ day_id, date: b.date, title: b.title, material: b.material, kg: round(b.kg, 3), m3: round(b.m3, 4), households: b.households.size })),
  };
}
