import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { blendSchema } from "@/lib/validation/blend";
import { blend, blendAdvice } from "@/lib/calc/blend";

// POST /api/blend — C:N and moisture of any mix, the water to reach a target moisture, and
// (for a pile, not a bed) the full mass of a green or brown that would bring it into range.
export const POST = handle(async ({ req }) => {
  const input = parseInput(blendSchema, await readJson(req));
  const mix = blend(input.components, input.target_moisture_pct);
  return NextResponse.json({ ...mix, advice: blendAdvice(mix) });
});
