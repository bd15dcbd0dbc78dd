import { deleteBed as removeBed } from "@/db/beds";

/** Deletes one of the gardener's own beds; false when there is no such bed of theirs. */
export async function deleteBed(id: string, ownerId: string): Promise<boolean> {
  return (await removeBed(id, ownerId)) > 0;
}
