import { deleteBed as removeBed } from "@/db/beds";
import { resolveContext, type Context } from "@/lib/context";

/** Deletes one of the gardener's own beds; false when there is no such bed of theirs. */
export async function deleteBed(id: string, ownerId: string, ctx: Context = {}): Promise<boolean> {
  return (await removeBed(id, ownerId, resolveContext(ctx).db)) > 0;
}
