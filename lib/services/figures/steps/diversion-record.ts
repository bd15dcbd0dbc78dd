import type { MaterialCode } from "@/lib/calc/facts";
import type { DiversionRecord } from "@/lib/calc/diversion";
import type { ListingUnit } from "@/lib/calc/units";

/**
 * One collected reservation or checked-in booking as a record the diversion sums are made from.
 * Rows have their declared types on both engines (db/dialect.ts): `at` is ISO text.
 */
export function diversionRecord(r: { quantity: number; household: string; at: string; material_code: string; unit: string; unit_size: number | null; unit_mass_kg?: number | null }): DiversionRecord {
  return {
    material: r.material_code as MaterialCode,
    quantity: r.quantity,
    unit: r.unit as ListingUnit,
    unitSize: r.unit_size ?? undefined,
    unitMassKg: r.unit_mass_kg ?? undefined,
    month: r.at.slice(0, 7),
    household: r.household,
  };
}
