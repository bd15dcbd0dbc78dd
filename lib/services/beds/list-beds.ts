import { listBeds as bedsOf, type BedRow } from "@/db/beds";

/** The gardener's beds, newest first. */
export async function listBeds(ownerId: string): Promise<BedRow[]> {
  return bedsOf(ownerId);
}
