import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { closeInvites, findOrgInvite } from "@/db/invites";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { InviteView, inviteView } from "@/lib/council/invites";

export async function revokeInvite(ctx: CouncilStaff, inviteId: string): Promise<InviteView> {
  return writeTransaction(db(), async (trx) => {
    const before = await findOrgInvite(inviteId, ctx.organisationId, trx);
    if (!before) throw notFound("That invitation");
    if (!(await closeInvites({ id: inviteId, organisation_id: ctx.organisationId }, "revoked", {}, trx))) {
      throw new ApiError("invalid_state", `That invitation is already ${before.status}.`);
    }
    const after = (await findOrgInvite(inviteId, ctx.organisationId, trx))!;
    await recordAudit({ actor_id: ctx.userId, action: "council.invite_revoke", subject_type: "organisation", subject_id: ctx.organisationId, before: inviteView(before), after: inviteView(after) }, trx);
    return inviteView(after);
  });
}
