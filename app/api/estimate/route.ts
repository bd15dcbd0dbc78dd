import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { estimateSchema } from "@/lib/validation/estimate";
import { estimate } from "@/lib/calc/estimate";

// POST /api/estimate — what a bed needs: layer quantities, water, blend, timeline, cautions.
export const POST = handle(async ({ req }) => {
  const input = parseInput(estimateSchema, await readJson(req));
  return NextResponse.json(estimate(input));
});
