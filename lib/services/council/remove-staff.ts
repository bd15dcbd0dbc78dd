import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { removeMembership } from "@/db/invites";
import { membershipsOf, removeRole } from "@/db/users";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilStaff } from "@/lib/auth/council-access";

/** The owner removes a staff member: the membership goes, and the council role with it. */
export async function removeStaff(ctx: CouncilStaff, userId: string) {
  if (userId === ctx.userId) throw new ApiError("invalid_state", "You cannot remove yourself; the account owner stays.");
  return writeTransaction(db(), async (trx) => {
    const member = (await membershipsOf(userId, trx)).find((m) => m.organisation_id === ctx.organisationId);
    if (!member) throw notFound("That staff member");
    if (member.org_role === "owner") throw new ApiError("invalid_state", "The account owner cannot be removed.");
    await removeMembership(ctx.organisationId, userId, trx);
    const stillCouncil = (await membershipsOf(userId, trx)).some((m) => m.kind === "council");
    if (!stillCouncil) await removeRole(userId, "council", trx);
    await recordAudit(
      { actor_id: ctx.userId, action: "council.member_remove", subject_type: "organisation", subject_id: ctx.organisationId, before: { user_id: userId, org_role: member.org_role, role: "council" }, after: { user_id: userId, removed: true, role_kept: stillCouncil } },
      trx,
    );
    return { user_id: userId, removed: true };
  });
}
