import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { requireUser } from "@/lib/auth/current-user";
import { matchSchema } from "@/lib/validation/match";
import { planPickups } from "@/lib/services/match/plan-pickups";

// POST /api/match — a pickup plan: which nearby listings cover the needs, how much from each,
// in what order, in how many carloads. Public for ad-hoc needs; a saved bed needs its owner.
export const POST = handle(async ({ req }) => {
  const input = parseInput(matchSchema, await readJson(req));
  const user = input.bed_id ? await requireUser(req) : null;
  return NextResponse.json(await planPickups(input, user));
});
