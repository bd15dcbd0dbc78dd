import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { parseInput } from "@/lib/api/errors";
import { cancelGiveawaySchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { cancelGiveaway } from "@/lib/services/giveaways/cancel-giveaway";

// POST /api/council/giveaways/:id/cancel — call the day off; everyone booked is e-mailed and
// every deposit hold released. Honours an Idempotency-Key.
export const POST = withAuth<{ id: string }>(
  idempotent(async ({ req, params, user }) => {
    const staff = councilOf(user);
    const input = parseInput(cancelGiveawaySchema, await readJson(req));
    return NextResponse.json(await cancelGiveaway(staff, params.id, input.reason));
  }),
  ["council"],
);
