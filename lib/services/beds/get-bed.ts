import { findBed, type BedRow } from "@/db/beds";
import { resolveContext, type Context } from "@/lib/context";

/** One of the gardener's own beds; someone else's bed is simply not found. */
export async function getBed(id: string, ownerId: string, ctx: Context = {}): Promise<BedRow | undefined> {
  return findBed(id, ownerId, resolveContext(ctx).db);
}
