import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { closeReportRow, findReport } from "@/db/reports";
import { findListingBrief } from "@/db/listing-status";
import { findUserById } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { auditActionsSince, recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { REPORT_REASON_LABELS } from "@/lib/validation/moderation";
import { resolveContext, type Context } from "@/lib/context";

const ACTION_WORDS: Record<string, string> = {
  "listing.hide": "hid the listing",
  "listing.restore": "showed the listing again",
  "user.suspend": "suspended the account",
  "user.restore": "lifted the account's suspension",
  "user.verify": "verified the account",
  "user.unverify": "removed the account's verification",
};

/** Closes a report with a note and tells the reporter the outcome, through the outbox, in one transaction. */
export async function closeReport(moderatorId: string, reportId: string, note: string, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const report = await findReport(reportId, trx);
    if (!report) throw notFound("That report");
    if (!(await closeReportRow(reportId, moderatorId, note, trx))) throw new ApiError("invalid_state", "That report is already closed.");
    // What was done about it: moderator actions on the subject since the report came in.
    const subjectType = report.listing_id ? "listing" : "user";
    const subjectId = report.listing_id ?? report.subject_user_id!;
    const actions = await auditActionsSince(subjectType, subjectId, report.created_at, Object.keys(ACTION_WORDS), trx);
    const reporter = await findUserById(report.reporter_id, trx);
    const subject = report.listing_id
      ? `the listing "${(await findListingBrief(report.listing_id, trx))?.title ?? "a listing"}"`
      : `the account ${(await findUserById(report.subject_user_id!, trx))?.display_name ?? "a person"}`;
    if (reporter) {
      const data = {
        name: reporter.display_name,
        subject,
        reason: REPORT_REASON_LABELS[report.reason].toLowerCase(),
        outcome: note,
        actions: [...new Set(actions.map((a) => ACTION_WORDS[a]))],
      };
      await enqueueEmail({ to: reporter.email, template: "report_outcome", data, dedupe_key: `report-outcome:${reportId}` }, trx);
    }
    await recordAudit({ actor_id: moderatorId, action: "report.close", subject_type: "report", subject_id: reportId, before: { status: "open" }, after: { status: "closed", note } }, trx);
    return { id: reportId, status: "closed" as const, outcome_note: note };
  });
}
