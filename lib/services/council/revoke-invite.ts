import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { closeInvites, findOrgInvite } from "@/db/invites";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { InviteView, inviteView } from "@/lib/council/invites";
import { resolveContext, type Context } from "@/lib/context";

export async function revokeInvite(staff: CouncilStaff, inviteId: string, ctx: Context = {}): Promise<InviteView> {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const before = await findOrgInvite(inviteId, staff.organisationId, trx);
    if (!before) throw notFound("That invitation");
    if (!(await closeInvites({ id: inviteId, organisation_id: staff.organisationId }, "revoked", {}, trx))) {
      throw new ApiError("invalid_state", `That invitation is already ${before.status}.`);
    }
    const after = (await findOrgInvite(inviteId, staff.organisationId, trx))!;
    await recordAudit({ actor_id: staff.userId, action: "council.invite_revoke", subject_type: "organisation", subject_id: staff.organisationId, before: inviteView(before), after: inviteView(after) }, trx);
    return inviteView(after);
  });
}
