import { findBed, type BedRow } from "@/db/beds";

/** One of the gardener's own beds; someone else's bed is simply not found. */
export async function getBed(id: string, ownerId: string): Promise<BedRow | undefined> {
  return findBed(id, ownerId);
}
