import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { inviteSchema } from "@/lib/validation/council";
import { councilOf, councilOwnerOf } from "@/lib/auth/council-access";
import { listInvites } from "@/lib/services/council/list-invites";
import { inviteStaff } from "@/lib/services/council/invite-staff";

// GET /api/council/invites — invitations still waiting for an answer.
export const GET = withAuth(async ({ user }) => {
  return NextResponse.json({ items: await listInvites(councilOf(user)) });
}, ["council"]);

// POST /api/council/invites — the owner invites a colleague by e-mail.
export const POST = withAuth(async ({ req, user }) => {
  const staff = councilOwnerOf(user);
  const input = parseInput(inviteSchema, await readJson(req));
  return NextResponse.json({ invite: await inviteStaff(staff, user.name, input.email) }, { status: 201 });
}, ["council"]);
