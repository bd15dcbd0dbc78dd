import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findUserById, rolesOf, updateUser } from "@/db/users";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { endEverySession } from "@/lib/auth/sessions";
import { UserAction } from "@/lib/services/moderation/moderate-account";
import { resolveContext, type Context } from "@/lib/context";

export async function moderateUser(moderatorId: string, userId: string, action: UserAction, note: string, reportId?: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  if (userId === moderatorId && (action === "suspend" || action === "verify")) {
    throw new ApiError("invalid_state", "Another moderator has to do that for your own account.");
  }
  return writeTransaction(q, async (trx) => {
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
