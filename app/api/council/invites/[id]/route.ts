import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { councilOwnerOf } from "@/lib/auth/council-access";
import { revokeInvite } from "@/lib/services/council/revoke-invite";

// DELETE /api/council/invites/:id — the owner withdraws an invitation.
export const DELETE = withAuth<{ id: string }>(async ({ params, user }) => {
  return NextResponse.json({ invite: await revokeInvite(councilOwnerOf(user), params.id) });
}, ["council"]);
