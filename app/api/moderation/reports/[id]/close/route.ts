import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { closeReportSchema } from "@/lib/validation/moderation";
import { closeReport } from "@/lib/services/moderation/close-report";

// POST /api/moderation/reports/:id/close — close with a note; the reporter gets the outcome by e-mail.
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(closeReportSchema, await readJson(req));
  return NextResponse.json({ report: await closeReport(user.id, params.id, input.note) });
}, ["moderator"]);
