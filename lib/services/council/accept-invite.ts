import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { addMembership, closeInvites, findInviteByTokenHash } from "@/db/invites";
import { membershipsOf, normaliseEmail, setRole } from "@/db/users";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { hashToken } from "@/lib/council/invites";
import { resolveContext, type Context } from "@/lib/context";

/** The invitee, signed in with the invited address, becomes staff with the council role. */
export async function acceptInvite(user: { id: string; email: string }, token: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const at = clock();
  const invite = await findInviteByTokenHash(hashToken(token), q);
  if (!invite) throw notFound("That invitation");
  if (normaliseEmail(user.email) !== invite.email) {
    throw new ApiError("forbidden", `This invitation was sent to ${invite.email}. Sign in with that address to accept it.`);
  }
  if (invite.status === "accepted" && invite.accepted_by === user.id) return { organisation_id: invite.organisation_id, already: true };
  if (invite.status !== "pending") throw new ApiError("invalid_state", `This invitation has been ${invite.status === "revoked" ? "withdrawn" : invite.status}. Ask for a new one.`);
  if (Date.parse(invite.expires_at) <= at.getTime()) throw new ApiError("invalid_state", "This invitation has expired. Ask for a new one.");
  const orgs = await membershipsOf(user.id, q);
  if (orgs.some((m) => m.organisation_id !== invite.organisation_id)) throw new ApiError("conflict", "Your account already belongs to another organisation.");
  return writeTransaction(q, async (trx) => {
    const now = at.toISOString();
    if (!(await closeInvites({ id: invite.id, organisation_id: invite.organisation_id }, "accepted", { accepted_by: user.id, accepted_at: now }, trx))) {
      throw new ApiError("invalid_state", "This invitation has just been used or withdrawn.");
    }
    await addMembership(invite.organisation_id, user.id, "staff", trx);
    await setRole(user.id, "council", "active", trx);
    await recordAudit(
      { actor_id: user.id, action: "council.member_add", subject_type: "organisation", subject_id: invite.organisation_id, after: { user_id: user.id, email: invite.email, org_role: "staff", invite_id: invite.id, invited_by: invite.invited_by } },
      trx,
    );
    return { organisation_id: invite.organisation_id, already: false };
  });
}
