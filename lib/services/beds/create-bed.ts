import "server-only";
import { db } from "@/db/index";
import { findBed, insertBed } from "@/db/beds";
import type { CreateBedInput } from "@/lib/validation/beds";
import { toBedView, type BedView } from "@/lib/beds/view";
import { shapeColumns } from "@/lib/beds/shape";

export async function createBed(ownerId: string, input: CreateBedInput): Promise<BedView> {
  return db().transaction(async (trx) => {
    const id = await insertBed(
      ownerId,
      { name: input.name, ...shapeColumns(input.bed, input.location), recipe: JSON.stringify(input.layers ?? {}), start_date: input.start_date ?? null },
      trx,
    );
    return toBedView((await findBed(id, ownerId, trx))!);
  });
}

