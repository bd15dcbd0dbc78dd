import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { reportSchema } from "@/lib/validation/moderation";
import { fileReport } from "@/lib/services/moderation/file-report";

// POST /api/reports — anyone signed in reports a listing or a person to the moderators.
export const POST = withAuth(async ({ req, user }) => {
  const input = parseInput(reportSchema, await readJson(req));
  const r = await fileReport(user.id, input);
  return NextResponse.json(
    { report: { id: r.id, subject_type: r.subject_type, listing_id: r.listing_id, user_id: r.subject_type === "user" ? r.subject_user_id : null, reason: r.reason, status: r.status, created_at: r.created_at } },
    { status: 201 },
  );
});
