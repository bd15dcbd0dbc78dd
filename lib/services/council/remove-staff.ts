import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { removeMembership } from "@/db/invites";
import { membershipsOf, removeRole } from "@/db/users";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

/** The owner removes a staff member: the membership goes, and the council role with it. */
export async function removeStaff(staff: CouncilStaff, userId: string, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  if (userId === staff.userId) throw new ApiError("invalid_state", "You cannot remove yourself; the account owner stays.");
  return writeTransaction(q, async (trx) => {
    const member = (await membershipsOf(userId, trx)).find((m) => m.organisation_id === staff.organisationId);
    if (!member) throw notFound("That staff member");
    if (member.org_role === "owner") throw new ApiError("invalid_state", "The account owner cannot be removed.");
    await removeMembership(staff.organisationId, userId, trx);
    const stillCouncil = (await membershipsOf(userId, trx)).some((m) => m.kind === "council");
    if (!stillCouncil) await removeRole(userId, "council", trx);
    await recordAudit(
      { actor_id: staff.userId, action: "council.member_remove", subject_type: "organisation", subject_id: staff.organisationId, before: { user_id: userId, org_role: member.org_role, role: "council" }, after: { user_id: userId, removed: true, role_kept: stillCouncil } },
      trx,
    );
    return { user_id: userId, removed: true };
  });
}
