import { NextResponse } from "next/server";
import { openApiDocument } from "@/lib/api/openapi";

export const dynamic = "force-static";

// GET /api/openapi.json — generated from the same zod schemas the handlers parse with.
export function GET() {
  return NextResponse.json(openApiDocument());
}
