import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { userModerationSchema } from "@/lib/validation/moderation";
import { moderateUser } from "@/lib/services/moderation/moderate-user";

// POST /api/moderation/users/:id — suspend or restore an account, verify a supplier or take it back.
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(userModerationSchema, await readJson(req));
  return NextResponse.json({ user: await moderateUser(user.id, params.id, input.action, input.note, input.report_id) });
}, ["moderator"]);
