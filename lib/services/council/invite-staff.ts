import "server-only";
import { randomBytes } from "node:crypto";
import { writeTransaction } from "@/db/write-transaction";
import { closeInvites, insertInvite } from "@/db/invites";
import { findUserByEmail, membershipsOf, normaliseEmail } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { recordAudit } from "@/db/audit";
import { ApiError } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { readableDateTime, DEFAULT_TIME_ZONE } from "@/lib/time/zoned";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { INVITE_TTL_DAYS, hashToken, InviteView, inviteView } from "@/lib/council/invites";

/** The owner invites a colleague: a single-use link by e-mail, through the outbox in the same transaction. */
export async function inviteStaff(staff: CouncilStaff, inviterName: string, rawEmail: string, ctx: Context = {}): Promise<InviteView> {
  const { db: q, clock } = resolveContext(ctx);
  const email = normaliseEmail(rawEmail);
  const existing = await findUserByEmail(email, q);
  if (existing) {
    const orgs = await membershipsOf(existing.id, q);
    if (orgs.some((m) => m.organisation_id === staff.organisationId)) {
      throw new ApiError("conflict", "That person is already on your staff.", { email: "Already on your staff." });
    }
    if (orgs.length) throw new ApiError("conflict", "That account already belongs to another organisation.", { email: "This account is staff of another organisation." });
  }
  const token = randomBytes(32).toString("base64url");
  const now = clock();
  const expires_at = new Date(now.getTime() + INVITE_TTL_DAYS * 86_400_000).toISOString();
  return writeTransaction(q, async (trx) => {
    // A new invitation replaces any still waiting for the same address.
    await closeInvites({ organisation_id: staff.organisationId, email }, "revoked", {}, trx);
    const invite = await insertInvite({ organisation_id: staff.organisationId, email, token_hash: hashToken(token), invited_by: staff.userId, expires_at }, trx);
    const data = {
      organisation: staff.organisationName,
      inviter: inviterName,
      url: `${appUrl()}/council/join?token=${encodeURIComponent(token)}`,
      expires: readableDateTime(expires_at, DEFAULT_TIME_ZONE),
    };
    await enqueueEmail({ to: email, template: "council_invite", data, dedupe_key: `council-invite:${invite.id}` }, trx);
    await recordAudit({ actor_id: staff.userId, action: "council.invite", subject_type: "organisation", subject_id: staff.organisationId, after: inviteView(invite) }, trx);
    return inviteView(invite);
  });
}
