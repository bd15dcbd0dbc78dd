import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { addMembership, closeInvites, findInviteByTokenHash, findOrgInvite, insertInvite, pendingInvites, removeMembership } from "@/db/invites";
import { findOrganisation } from "@/db/organisations";
import { findUserByEmail, membershipsOf, normaliseEmail, removeRole, setRole } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { recordAudit } from "@/db/audit";
import type { InviteRow } from "@/db/types";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/app-url";
import { readableDateTime, DEFAULT_TIME_ZONE } from "@/lib/time/zoned";
import type { CouncilContext } from "@/lib/auth/council-access";

/** An invitation link works for a week (common practice, no source). */
export const INVITE_TTL_DAYS = 7;

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export interface InviteView {
  id: string;
  email: string;
  status: InviteRow["status"];
  expires_at: string;
  created_at: string;
}
const inviteView = (r: InviteRow): InviteView => ({ id: r.id, email: r.email, status: r.status, expires_at: r.expires_at, created_at: r.created_at });

/** The owner invites a colleague: a single-use link by e-mail, through the outbox in the same transaction. */
export async function inviteStaff(ctx: CouncilContext, inviterName: string, rawEmail: string, clock: () => Date = () => new Date()): Promise<InviteView> {
  const email = normaliseEmail(rawEmail);
  const existing = await findUserByEmail(email);
  if (existing) {
    const orgs = await membershipsOf(existing.id);
    if (orgs.some((m) => m.organisation_id === ctx.organisationId)) {
      throw new ApiError("conflict", "That person is already on your staff.", { email: "Already on your staff." });
    }
    if (orgs.length) throw new ApiError("conflict", "That account already belongs to another organisation.", { email: "This account is staff of another organisation." });
  }
  const token = randomBytes(32).toString("base64url");
  const now = clock();
  const expires_at = new Date(now.getTime() + INVITE_TTL_DAYS * 86_400_000).toISOString();
  return writeTransaction(db(), async (trx) => {
    // A new invitation replaces any still waiting for the same address.
    await closeInvites({ organisation_id: ctx.organisationId, email }, "revoked", {}, trx);
    const invite = await insertInvite({ organisation_id: ctx.organisationId, email, token_hash: hashToken(token), invited_by: ctx.userId, expires_at }, trx);
    const data = {
      organisation: ctx.organisationName,
      inviter: inviterName,
      url: `${appUrl()}/council/join?token=${encodeURIComponent(token)}`,
      expires: readableDateTime(expires_at, DEFAULT_TIME_ZONE),
    };
    await enqueueEmail({ to: email, template: "council_invite", data, dedupe_key: `council-invite:${invite.id}` }, trx);
    await recordAudit({ actor_id: ctx.userId, action: "council.invite", subject_type: "organisation", subject_id: ctx.organisationId, after: inviteView(invite) }, trx);
    return inviteView(invite);
  });
}

export async function listInvites(ctx: CouncilContext, clock: () => Date = () => new Date()): Promise<InviteView[]> {
  return (await pendingInvites(ctx.organisationId, clock().toISOString())).map(inviteView);
}

export async function revokeInvite(ctx: CouncilContext, inviteId: string): Promise<InviteView> {
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

/** What the join page shows before anyone signs in: whose invitation, to which address, and whether it still works. */
export async function describeInvite(token: string, clock: () => Date = () => new Date()) {
  const invite = await findInviteByTokenHash(hashToken(token));
  if (!invite) return null;
  const org = await findOrganisation(invite.organisation_id);
  const expired = Date.parse(invite.expires_at) <= clock().getTime();
  return { email: invite.email, organisation: org?.name ?? "a council", status: expired && invite.status === "pending" ? ("expired" as const) : invite.status, has_account: !!(await findUserByEmail(invite.email)) };
}

/** The invitee, signed in with the invited address, becomes staff with the council role. */
export async function acceptInvite(user: { id: string; email: string }, token: string, clock: () => Date = () => new Date()) {
  const invite = await findInviteByTokenHash(hashToken(token));
  if (!invite) throw notFound("That invitation");
  if (normaliseEmail(user.email) !== invite.email) {
    throw new ApiError("forbidden", `This invitation was sent to ${invite.email}. Sign in with that address to accept it.`);
  }
  if (invite.status === "accepted" && invite.accepted_by === user.id) return { organisation_id: invite.organisation_id, already: true };
  if (invite.status !== "pending") throw new ApiError("invalid_state", `This invitation has been ${invite.status === "revoked" ? "withdrawn" : invite.status}. Ask for a new one.`);
  if (Date.parse(invite.expires_at) <= clock().getTime()) throw new ApiError("invalid_state", "This invitation has expired. Ask for a new one.");
  const orgs = await membershipsOf(user.id);
  if (orgs.some((m) => m.organisation_id !== invite.organisation_id)) throw new ApiError("conflict", "Your account already belongs to another organisation.");
  return writeTransaction(db(), async (trx) => {
    const now = clock().toISOString();
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

/** The owner removes a staff member: the membership goes, and the council role with it. */
export async function removeStaff(ctx: CouncilContext, userId: string) {
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
