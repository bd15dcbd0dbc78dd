import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { updateGiveawaySchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { daySheet } from "@/lib/services/giveaways/get-day-sheet";
import { updateGiveaway } from "@/lib/services/giveaways/update-giveaway";

// GET /api/council/giveaways/:id — the day with everyone booked on it (the day's sheet).
export const GET = withAuth<{ id: string }>(async ({ params, user }) => {
  return NextResponse.json(await daySheet(councilOf(user), params.id));
}, ["council"]);

// PATCH /api/council/giveaways/:id — change a day (date, unit and material only before anyone books).
export const PATCH = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const staff = councilOf(user);
  const input = parseInput(updateGiveawaySchema, await readJson(req));
  return NextResponse.json({ giveaway: await updateGiveaway(staff, params.id, input) });
}, ["council"]);
