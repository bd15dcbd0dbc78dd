import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { signUpSchema } from "@/lib/validation/auth";
import { signUp } from "@/lib/services/accounts/sign-up";
import { LIMITS, clientAddress, consume } from "@/lib/security/rate-limit";

// POST /api/users — join. Always 202 with the same answer: whether the address already had
// an account is told only in the e-mail sent to it (a confirmation link, or "you already have
// an account"). Limited per client address.
export const POST = handle(async ({ req }) => {
  const input = parseInput(signUpSchema, await readJson(req));
  await consume([[LIMITS.signUpAddress, clientAddress(req.headers)]]);
  return NextResponse.json(await signUp(input), { status: 202 });
});
