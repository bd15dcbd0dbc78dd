import { db, type Db } from "./index";

export interface BedRow {
  id: string;
  owner_id: string;
  name: string;
  /** JSON: {length_m, width_m} or {polygon}. */
  shape: string;
  area_m2: number;
  lat: number | null;
  lng: number | null;
  /** JSON: the `layers` object of the estimate schema. */
  recipe: string;
  start_date: string | null;
  created_at: string;
  updated_at: string;
}

/** A bed, only if `ownerId` owns it: anyone else's is "not found". */
export async function findOwnBed(id: string, ownerId: string, q: Db = db()): Promise<BedRow | undefined> {
  return q<BedRow>("beds")
    .select("id", "owner_id", "name", "shape", "area_m2", "lat", "lng", "recipe", "start_date", "created_at", "updated_at")
    .where({ id, owner_id: ownerId })
    .first();
}
