import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { blendSchema } from "@/lib/validation/blend";
import { blend } from "@/lib/calc/blend";

// POST /api/blend — C:N and moisture of any mix, and the water to reach a target moisture.
export const POST = handle(async ({ req }) => {
  const input = parseInput(blendSchema, await readJson(req));
  return NextResponse.json(blend(input.components, input.target_moisture_pct));
});
