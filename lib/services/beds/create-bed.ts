import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findBed, insertBed } from "@/db/beds";
import type { CreateBedInput } from "@/lib/validation/beds";
import { toBedView, type BedView } from "@/lib/beds/view";
import { shapeColumns } from "@/lib/beds/shape";
import { resolveContext, type Context } from "@/lib/context";

export async function createBed(ownerId: string, input: CreateBedInput, ctx: Context = {}): Promise<BedView> {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const id = await insertBed(
      ownerId,
      { name: input.name, ...shapeColumns(input.bed, input.location), recipe: JSON.stringify(input.layers ?? {}), start_date: input.start_date ?? null },
      trx,
    );
    return toBedView((await findBed(id, ownerId, trx))!);
  });
}

