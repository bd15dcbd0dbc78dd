import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { listMembers } from "@/lib/services/council/list-members";

// GET /api/council/members — the staff of the signed-in council member's organisation.
export const GET = withAuth(async ({ user }) => {
  if (!user.organisation) throw new ApiError("forbidden", "Your account is not part of a council.");
  return NextResponse.json({ organisation: user.organisation, members: await listMembers(user.organisation.id) });
}, ["council"]);
