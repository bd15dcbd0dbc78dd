import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseNeedBody, updateNeedSchema } from "@/lib/validation/needs";
import { getNeed } from "@/lib/services/needs/get-need";
import { changeNeed } from "@/lib/services/needs/change-need";
import { deleteNeed } from "@/lib/services/needs/delete-need";

type P = { id: string };

// GET /api/needs/:id — one of my needs; anyone else's is not found.
export const GET = withAuth<P>(async ({ params, user }) => {
  return NextResponse.json({ need: await getNeed(user.id, params.id) });
});

// PATCH /api/needs/:id — change the amount, radius, date or alerts; close it, or open it again.
export const PATCH = withAuth<P>(async ({ req, params, user }) => {
  const patch = parseNeedBody(updateNeedSchema, await readJson(req));
  return NextResponse.json({ need: await changeNeed(user.id, params.id, patch) });
});

// DELETE /api/needs/:id — remove it and its alerts.
export const DELETE = withAuth<P>(async ({ params, user }) => {
  await deleteNeed(user.id, params.id);
  return new NextResponse(null, { status: 204 });
});
