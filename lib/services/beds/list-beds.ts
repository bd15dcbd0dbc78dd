import { listBeds as bedsOf, type BedRow } from "@/db/beds";
import { resolveContext, type Context } from "@/lib/context";

/** The gardener's beds, newest first. */
export async function listBeds(ownerId: string, ctx: Context = {}): Promise<BedRow[]> {
  return bedsOf(ownerId, resolveContext(ctx).db);
}
