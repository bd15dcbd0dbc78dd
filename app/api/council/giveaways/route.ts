import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { createGiveawaySchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { createGiveaway } from "@/lib/services/giveaways/create-giveaway";
import { councilDays } from "@/lib/services/giveaways/list-council-days";
import { requireVerifiedEmail } from "@/lib/auth/current-user";

// GET /api/council/giveaways — my council's days, newest first.
export const GET = withAuth(async ({ user }) => {
  return NextResponse.json({ items: await councilDays(councilOf(user)) });
}, ["council"]);

// POST /api/council/giveaways — a new giveaway day with its slots.
export const POST = withAuth(async ({ req, user }) => {
  requireVerifiedEmail(user);
  const staff = councilOf(user);
  const input = parseInput(createGiveawaySchema, await readJson(req));
  return NextResponse.json({ giveaway: await createGiveaway(staff, input) }, { status: 201 });
}, ["council"]);
