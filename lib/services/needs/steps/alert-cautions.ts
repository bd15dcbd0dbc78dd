import "server-only";
import type { ListingRow } from "@/db/types";
import { listingCautions } from "@/lib/calc/cautions";

/** The cautions an alert e-mail carries: the material's own, without the general lines. */
export function alertCautions(l: Pick<ListingRow, "material_code" | "unit" | "unit_mass_kg" | "quality">): string[] {
  // A listing saved before a declaration existed reads as none: the general caution still applies.
  return listingCautions({ material: l.material_code, unit: l.unit, unit_mass_kg: l.unit_mass_kg === null ? null : Number(l.unit_mass_kg), quality: l.quality })
    .filter((c) => c.kind !== "gloves")
    .map((c) => c.text);
}
