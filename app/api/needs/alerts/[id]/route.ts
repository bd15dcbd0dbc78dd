import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { updateAlertSchema } from "@/lib/validation/needs";
import { updateAlert } from "@/lib/services/needs/update-alert";

// PATCH /api/needs/alerts/:id { seen: true } or { dismissed: true } — one of my notices.
export const PATCH = withAuth<{ id: string }>(async ({ req, params, user }) => {
  await updateAlert(user.id, params.id, parseInput(updateAlertSchema, await readJson(req)));
  return new NextResponse(null, { status: 204 });
});
