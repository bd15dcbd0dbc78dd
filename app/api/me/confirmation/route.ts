import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { resendConfirmation } from "@/lib/services/accounts/resend-confirmation";

// POST /api/me/confirmation — send the link that confirms the account's e-mail address again.
export const POST = withAuth(async ({ user }) => NextResponse.json(await resendConfirmation(user.id), { status: 202 }));
