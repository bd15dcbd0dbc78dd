import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { notFound, parseInput } from "@/lib/api/errors";
import { updateBedSchema } from "@/lib/validation/beds";
import { editBed } from "@/lib/services/beds/edit-bed";
import { getBed } from "@/lib/services/beds/get-bed";
import { deleteBed } from "@/lib/services/beds/delete-bed";
import { bedEstimate, toBedView } from "@/lib/beds/view";

type P = { id: string };

// GET /api/beds/:id — one of my beds with its estimate.
export const GET = withAuth<P>(async ({ params, user }) => {
  const row = await getBed(params.id, user.id);
  if (!row) throw notFound("That bed");
  const bed = toBedView(row);
  return NextResponse.json({ bed, estimate: bedEstimate(bed, new Date(), user.unit_system) });
}, ["gardener"]);

// PATCH /api/beds/:id — change any of name, shape, recipe, start date, location.
export const PATCH = withAuth<P>(async ({ req, params, user }) => {
  const input = parseInput(updateBedSchema, await readJson(req));
  const bed = await editBed(user.id, params.id, input);
  return NextResponse.json({ bed, estimate: bedEstimate(bed, new Date(), user.unit_system) });
}, ["gardener"]);

// DELETE /api/beds/:id
export const DELETE = withAuth<P>(async ({ params, user }) => {
  if (!(await deleteBed(params.id, user.id))) throw notFound("That bed");
  return new NextResponse(null, { status: 204 });
}, ["gardener"]);
