import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { auditQuerySchema } from "@/lib/validation/moderation";
import { searchAudit } from "@/lib/services/moderation/search-audit";

// GET /api/moderation/audit — the append-only log of moderator and council actions, newest first.
// There is deliberately no PATCH, PUT or DELETE here or anywhere: the log only grows.
export const GET = withAuth(async ({ req }) => {
  const query = parseInput(auditQuerySchema, Object.fromEntries(req.nextUrl.searchParams));
  const rows = await searchAudit(query);
  const items = rows.map((r) => ({ ...r, before: r.before ? JSON.parse(r.before) : null, after: r.after ? JSON.parse(r.after) : null }));
  return NextResponse.json({ items, next_before_id: rows.length === query.limit ? rows[rows.length - 1].id : null });
}, ["moderator"]);
