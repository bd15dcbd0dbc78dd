// "3 bales" means little on its own: what it comes to in volume, area or weight, in the
// reader's own units (through lib/calc/units, the one conversion module), the weight from the
// one mass function every other screen uses (lib/calc/mass.ts).
import type { MaterialCode } from "@/lib/calc/facts";
import { unitAmount } from "@/lib/calc/mass";
import type { ListingUnit, UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";

export function equivalentOf(
  l: { material: string; unit: string; unit_size: number | null; unit_mass_kg: number | null },
  quantity: number,
  system: UnitSystem,
): string | null {
  if (!Number.isFinite(quantity) || quantity <= 0) return null;
  const parts: string[] = [];
  const one = unitAmount(l.material as MaterialCode, l.unit as ListingUnit, l);
  if ((l.unit === "bags" || l.unit === "bales") && one) parts.push(formatQuantity(quantity * one.handed_m3, "m3", system));
  if (l.unit === "sheets" && one?.area_m2) parts.push(`covers about ${formatQuantity(quantity * one.area_m2, "m2", system)}`);
  if (l.unit !== "kg" && one) parts.push(`about ${formatQuantity(quantity * one.kg, "kg", system)}`);
  if (system === "imperial" && (l.unit === "kg" || l.unit === "m3" || l.unit === "m2")) parts.push(formatQuantity(quantity, l.unit, system));
  return parts.length ? parts.join(", ") : null;
}
