import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { changePasswordSchema } from "@/lib/validation/auth";
import { changePassword } from "@/lib/services/accounts/change-password";

// POST /api/me/password — a new password; every session of the account ends, this one too.
export const POST = withAuth(async ({ req, user }) => {
  const input = parseInput(changePasswordSchema, await readJson(req));
  return NextResponse.json(await changePassword(user.id, input));
});
