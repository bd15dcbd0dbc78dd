import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { roleDecisionSchema } from "@/lib/validation/moderation";
import { decideRoleRequest } from "@/lib/services/moderation/decide-role-request";

// POST /api/moderation/role-requests/:userId — approve or refuse a requested role.
export const POST = withAuth<{ userId: string }>(async ({ req, params, user }) => {
  const input = parseInput(roleDecisionSchema, await readJson(req));
  const result = await decideRoleRequest(user.id, params.userId, input.role, input.decision);
  return NextResponse.json({ result });
}, ["moderator"]);
