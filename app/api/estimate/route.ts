import { NextResponse } from "next/server";
import { handle, readJson } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { estimateSchema } from "@/lib/validation/estimate";
import { estimateBed } from "@/lib/services/beds/estimate-bed";

// POST /api/estimate — what a bed needs: layer quantities, water, blend, timeline, cautions,
// and with a plan (or a match) what it will cost.
export const POST = handle(async ({ req }) => {
  const input = parseInput(estimateSchema, await readJson(req));
  return NextResponse.json(await estimateBed(input));
});
