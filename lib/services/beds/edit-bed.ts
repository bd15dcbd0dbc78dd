import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findBed, updateBed, type BedWrite } from "@/db/beds";
import { notFound } from "@/lib/api/errors";
import type { UpdateBedInput } from "@/lib/validation/beds";
import { toBedView, type BedView } from "@/lib/beds/view";
import { shapeColumns } from "@/lib/beds/shape";
import { resolveContext, type Context } from "@/lib/context";

export async function editBed(ownerId: string, id: string, input: UpdateBedInput, ctx: Context = {}): Promise<BedView> {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const current = await findBed(id, ownerId, trx);
    if (!current) throw notFound("That bed");
    const view = toBedView(current);
    const patch: Partial<BedWrite> = {};
    if (input.name !== undefined) patch.name = input.name;
    if (input.bed !== undefined || input.location !== undefined) {
      Object.assign(patch, shapeColumns(input.bed ?? view.shape, input.location === undefined ? view.location : input.location));
    }
    if (input.layers !== undefined) patch.recipe = JSON.stringify(input.layers);
    if (input.start_date !== undefined) patch.start_date = input.start_date;
    await updateBed(id, ownerId, patch, trx);
    return toBedView((await findBed(id, ownerId, trx))!);
  });
}
