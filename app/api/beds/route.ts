import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { createBedSchema } from "@/lib/validation/beds";
import { createBed } from "@/lib/services/beds/create-bed";
import { listBeds } from "@/lib/services/beds/list-beds";
import { bedEstimate, toBedView } from "@/lib/beds/view";

// GET /api/beds — my beds.
export const GET = withAuth(async ({ user }) => {
  const beds = (await listBeds(user.id)).map(toBedView);
  return NextResponse.json({ items: beds });
}, ["gardener"]);

// POST /api/beds — save a bed with its shape, recipe and start date.
export const POST = withAuth(async ({ req, user }) => {
  const input = parseInput(createBedSchema, await readJson(req));
  const bed = await createBed(user.id, input);
  return NextResponse.json({ bed, estimate: bedEstimate(bed, new Date(), user.unit_system) }, { status: 201 });
}, ["gardener"]);
