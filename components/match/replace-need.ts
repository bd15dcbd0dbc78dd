import type { MaterialCode } from "@/lib/calc/facts";
import type { Need } from "@/lib/match/types";
import { convertNeed, NEED_UNITS } from "@/lib/match/units";

/**
 * The needs with what is missing of `short` asked for as `material` instead: the original
 * need keeps what nearby listings did cover, the substitute takes the rest (in the same
 * unit where it can, else through its weight).
 */
export function replaceNeed(needs: readonly Need[], short: Need, material: MaterialCode): Need[] {
  const unit = NEED_UNITS[material].includes(short.unit) ? short.unit : NEED_UNITS[material][0];
  const quantity = unit === short.unit ? short.quantity : convertNeed(material, convertNeed(short.material, short.quantity, short.unit, "kg"), "kg", unit);
  const out: Need[] = [];
  for (const n of needs) {
    if (n.material !== short.material) out.push(n);
    else {
      const kept = Math.round((n.quantity - convertNeed(n.material, short.quantity, short.unit, n.unit)) * 1000) / 1000;
      if (kept > 0) out.push({ ...n, quantity: kept });
    }
  }
  const same = out.find((n) => n.material === material);
  if (same) same.quantity = Math.round((same.quantity + convertNeed(material, quantity, unit, same.unit)) * 1000) / 1000;
  else out.push({ material, quantity: Math.round(quantity * 1000) / 1000, unit });
  return out;
}
