import "server-only";
import type { DemandSourceRow } from "@/db/needs";
import type { DemandRow } from "@/lib/needs/demand";

/** An open need as the demand figures count it (lib/needs/demand.ts): numbers as numbers. */
export const toDemandRow = (r: DemandSourceRow): DemandRow => ({
  owner_id: r.owner_id,
  material: r.material_code,
  quantity: Number(r.quantity),
  unit: r.unit,
  radius_km: Number(r.radius_km),
  needed_by: r.needed_by,
  lat: Number(r.lat),
  lng: Number(r.lng),
});
