import "server-only";
import { db } from "@/db/index";
import { findBed, insertBed, updateBed, type BedWrite } from "@/db/beds";
import { notFound } from "@/lib/api/errors";
import { polygonArea, polygonCentroid, rectangleArea } from "@/lib/calc/area";
import type { CreateBedInput, UpdateBedInput } from "@/lib/validation/beds";
import { toBedView, type BedShape, type BedView } from "@/lib/beds/view";

function shapeColumns(shape: BedShape, location: { lat: number; lng: number } | null | undefined): Pick<BedWrite, "shape" | "area_m2" | "lat" | "lng"> {
  const area = "polygon" in shape ? polygonArea(shape.polygon) : rectangleArea(shape.length_m, shape.width_m);
  // An outline knows where it is; a rectangle is wherever the gardener put the pin.
  const where = "polygon" in shape ? polygonCentroid(shape.polygon) : (location ?? null);
  return { shape: JSON.stringify(shape), area_m2: Math.round(area * 1000) / 1000, lat: where?.lat ?? null, lng: where?.lng ?? null };
}

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

export async function editBed(ownerId: string, id: string, input: UpdateBedInput): Promise<BedView> {
  return db().transaction(async (trx) => {
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
