import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { findUserById, rolesOf, updateUser } from "@/db/users";
import { findListingBrief } from "@/db/listing-status";
import { moveStatus } from "@/db/listings";
import type { ListingStatus } from "@/db/types";
import { lastAudit, recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { endEverySession } from "@/lib/auth/sessions";

// A moderator's actions on a listing or an account. Each one is a conditional change and an
// audit row in one transaction, so the log can never disagree with what happened.

export type ListingAction = "hide" | "restore";
export type UserAction = "suspend" | "restore" | "verify" | "unverify";

export async function moderateListing(moderatorId: string, listingId: string, action: ListingAction, note: string, reportId?: string) {
  return writeTransaction(db(), async (trx) => {
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

export async function moderateUser(moderatorId: string, userId: string, action: UserAction, note: string, reportId?: string, clock: () => Date = () => new Date()) {
  if (userId === moderatorId && (action === "suspend" || action === "verify")) {
    throw new ApiError("invalid_state", "Another moderator has to do that for your own account.");
  }
  return writeTransaction(db(), async (trx) => {
    const user = await findUserById(userId, trx);
    if (!user) throw notFound("That person");
    const now = clock().toISOString();
    const before = { suspended_at: user.suspended_at, verified_at: user.verified_at };
    let patch: { suspended_at?: string | null; verified_at?: string | null };
    switch (action) {
      case "suspend":
        if (user.suspended_at) throw new ApiError("invalid_state", "That account is already suspended.");
        patch = { suspended_at: now };
        break;
      case "restore":
        if (!user.suspended_at) throw new ApiError("invalid_state", "That account is not suspended.");
        patch = { suspended_at: null };
        break;
      case "verify": {
        if (user.verified_at) throw new ApiError("invalid_state", "That account is already verified.");
        const roles = (await rolesOf(userId, trx)).filter((r) => r.status === "active").map((r) => r.role);
        if (!roles.some((r) => (LISTING_ROLES as readonly string[]).includes(r))) {
          throw new ApiError("invalid_state", "Only accounts that give material (suppliers, growers, councils) can be verified.");
        }
        patch = { verified_at: now };
        break;
      }
      case "unverify":
        if (!user.verified_at) throw new ApiError("invalid_state", "That account is not verified.");
        patch = { verified_at: null };
        break;
    }
    await updateUser(userId, patch, trx);
    // A suspension signs the person out everywhere, at once.
    if (action === "suspend") await endEverySession(userId, "suspended", clock, trx);
    await recordAudit({ actor_id: moderatorId, action: `user.${action}`, subject_type: "user", subject_id: userId, before, after: { ...before, ...patch, note, report_id: reportId ?? null } }, trx);
    const after = (await findUserById(userId, trx))!;
    return { id: userId, suspended: !!after.suspended_at, verified: !!after.verified_at };
  });
}
