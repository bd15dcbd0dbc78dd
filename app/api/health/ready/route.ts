import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { readiness } from "@/lib/health/readiness";

export const dynamic = "force-dynamic";

// GET /api/health/ready — whether this process can serve everything right now: 200 with
// { ok: true, checks } or 503 with the same shape and ok: false, naming the failing checks.
// For monitors and load balancers; GET /api/health stays the cheap "the process is up".
export const GET = handle(async () => {
  const result = await readiness();
  return NextResponse.json(result, { status: result.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
});
