import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { acceptInviteSchema } from "@/lib/validation/council";
import { acceptInvite } from "@/lib/services/council/accept-invite";

// POST /api/council/invites/accept — the invitee, signed in with the invited address, joins the staff.
export const POST = withAuth(async ({ req, user }) => {
  const input = parseInput(acceptInviteSchema, await readJson(req));
  return NextResponse.json(await acceptInvite(user, input.token));
});
