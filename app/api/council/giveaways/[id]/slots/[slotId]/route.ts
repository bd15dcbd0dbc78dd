import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { updateSlotSchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { removeGiveawaySlot } from "@/lib/services/giveaways/remove-giveaway-slot";
import { resizeGiveawaySlot } from "@/lib/services/giveaways/resize-giveaway-slot";

type P = { id: string; slotId: string };

// PATCH /api/council/giveaways/:id/slots/:slotId — change how many households a slot takes.
export const PATCH = withAuth<P>(async ({ req, params, user }) => {
  const staff = councilOf(user);
  const input = parseInput(updateSlotSchema, await readJson(req));
  return NextResponse.json({ slot: await resizeGiveawaySlot(staff, params.id, params.slotId, input.capacity) });
}, ["council"]);

// DELETE /api/council/giveaways/:id/slots/:slotId — remove a slot nobody has booked.
export const DELETE = withAuth<P>(async ({ params, user }) => {
  await removeGiveawaySlot(councilOf(user), params.id, params.slotId);
  return new Response(null, { status: 204 });
}, ["council"]);
