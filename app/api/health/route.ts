import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { databaseAnswers } from "@/lib/services/health/check-database";

export const dynamic = "force-dynamic";

// GET /api/health — the app is up and its database answers.
export const GET = handle(async () => {
  if (!(await databaseAnswers())) throw new ApiError("internal", "The database is not answering.");
  return NextResponse.json({ ok: true });
});
