import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { signOutEverywhere } from "@/lib/services/accounts/sign-out-everywhere";

// DELETE /api/me/sessions — sign out everywhere: every session of the account ends, this one too.
export const DELETE = withAuth(async ({ user }) => NextResponse.json(await signOutEverywhere(user.id)));
