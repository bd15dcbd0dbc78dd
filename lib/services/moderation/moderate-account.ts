import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findListingBrief } from "@/db/listing-status";
import { moveStatus } from "@/db/listings";
import type { ListingStatus } from "@/db/types";
import { lastAudit, recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";

// A moderator's actions on a listing or an account. Each one is a conditional change and an
// audit row in one transaction, so the log can never disagree with what happened.

export type ListingAction = "hide" | "restore";
export type UserAction = "suspend" | "restore" | "verify" | "unverify";

export async function moderateListing(moderatorId: string, listingId: string, action: ListingAction, note: string, reportId?: string, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const before = await findListingBrief(listingId, trx);
    if (!before) throw notFound("That listing");
    let to: ListingStatus;
    if (action === "hide") {
      if (before.status === "hidden") throw new ApiError("invalid_state", "That listing is already hidden.");
      to = "hidden";
    } else {
      if (before.status !== "hidden") throw new ApiError("invalid_state", "That listing is not hidden.");
      // Back to what it was before it was hidden; paused when that is unknown, so its owner decides.
      const hid = await lastAudit("listing", listingId, "listing.hide", trx);
      const was = hid?.before ? (JSON.parse(hid.before) as { status?: ListingStatus }).status : undefined;
      to = was && was !== "hidden" ? was : "paused";
    }
    if (!(await moveStatus(listingId, [before.status as ListingStatus], to, trx))) throw new ApiError("invalid_state", "That listing has just changed; reload and try again.");
    await recordAudit(
      { actor_id: moderatorId, action: `listing.${action}`, subject_type: "listing", subject_id: listingId, before: { status: before.status, title: before.title }, after: { status: to, note, report_id: reportId ?? null } },
      trx,
    );
    return { id: listingId, status: to };
  });
}

