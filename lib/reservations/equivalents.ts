// "3 bales" means little on its own: what it comes to in volume, area or weight, in the
// reader's own units (through lib/calc/units, the one conversion module).
import { formatQuantity, type UnitSystem } from "@/lib/calc/units";

export function equivalentOf(l: { unit: string; unit_size: number | null; unit_mass_kg: number | null }, quantity: number, system: UnitSystem): string | null {
  if (!Number.isFinite(quantity) || quantity <= 0) return null;
  const parts: string[] = [];
  if ((l.unit === "bags" || l.unit === "bales") && l.unit_size) parts.push(formatQuantity(quantity * l.unit_size, "m3", system));
  if (l.unit === "sheets" && l.unit_size) parts.push(`covers about ${formatQuantity(quantity * l.unit_size, "m2", system)}`);
  if (l.unit_mass_kg) parts.push(`about ${formatQuantity(quantity * l.unit_mass_kg, "kg", system)}`);
  if (system === "imperial" && (l.unit === "kg" || l.unit === "m3" || l.unit === "m2")) parts.push(formatQuantity(quantity, l.unit, system));
  return parts.length ? parts.join(", ") : null;
}
