import "server-only";
import { insertReport, reportsSince } from "@/db/reports";
import { findListingBrief } from "@/db/listing-status";
import { findUserById } from "@/db/users";
import { ApiError, notFound } from "@/lib/api/errors";
import type { ReportInput } from "@/lib/validation/moderation";
import { resolveContext, type Context } from "@/lib/context";

/** More reports than this from one account in a day is a flood, not a signal (common practice, no source). */
export const REPORTS_PER_DAY = 10;

export async function fileReport(reporterId: string, input: ReportInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const since = new Date(clock().getTime() - 86_400_000).toISOString();
  if ((await reportsSince(reporterId, since, q)) >= REPORTS_PER_DAY) {
    throw new ApiError("rate_limited", `You have sent ${REPORTS_PER_DAY} reports in the last day. Our moderators will get to them; please wait before sending more.`);
  }
  let subject: { subject_type: "listing" | "user"; listing_id: string | null; subject_user_id: string };
  if (input.listing_id) {
    const listing = await findListingBrief(input.listing_id, q);
    // A draft is only its owner's; to anyone else it does not exist.
    if (!listing || listing.status === "draft") throw notFound("That listing");
    if (listing.owner_id === reporterId) throw new ApiError("invalid_input", "You cannot report your own listing.", { listing_id: "This is your own listing." });
    subject = { subject_type: "listing", listing_id: listing.id, subject_user_id: listing.owner_id };
  } else {
    const person = await findUserById(input.user_id!, q);
    if (!person) throw notFound("That person");
    if (person.id === reporterId) throw new ApiError("invalid_input", "You cannot report yourself.", { user_id: "This is your own account." });
    subject = { subject_type: "user", listing_id: null, subject_user_id: person.id };
  }
  return insertReport({ reporter_id: reporterId, ...subject, reason: input.reason, text: input.text }, q);
}
