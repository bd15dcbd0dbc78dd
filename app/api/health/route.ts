import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { db } from "@/db/index";

export const dynamic = "force-dynamic";

// GET /api/health — the app is up and its database answers.
export const GET = handle(async () => {
  try {
    await db().raw("select 1");
  } catch {
    throw new ApiError("internal", "The database is not answering.");
  }
  return NextResponse.json({ ok: true });
});
