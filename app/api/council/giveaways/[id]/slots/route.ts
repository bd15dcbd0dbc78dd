import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { addSlotsSchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { addGiveawaySlots } from "@/lib/services/giveaways/change-giveaway-slots";

// POST /api/council/giveaways/:id/slots — add time slots (local wall-clock times of the day).
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const staff = councilOf(user);
  const input = parseInput(addSlotsSchema, await readJson(req));
  return NextResponse.json({ slots: await addGiveawaySlots(staff, params.id, input.slots) }, { status: 201 });
}, ["council"]);
