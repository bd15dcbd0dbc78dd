import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { signUpSchema } from "@/lib/validation/auth";
import { signUp } from "@/lib/services/sign-up";

// POST /api/users — create an account (a gardener); sign in afterwards.
export const POST = handle(async ({ req }) => {
  const input = parseInput(signUpSchema, await readJson(req));
  const user = await signUp(input);
  return NextResponse.json({ user }, { status: 201 });
});
