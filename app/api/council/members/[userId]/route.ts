import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { councilOwnerOf } from "@/lib/auth/council-access";
import { removeStaff } from "@/lib/services/council/remove-staff";

// DELETE /api/council/members/:userId — the owner removes a staff member.
export const DELETE = withAuth<{ userId: string }>(async ({ params, user }) => {
  return NextResponse.json(await removeStaff(councilOwnerOf(user), params.userId));
}, ["council"]);
