import "server-only";
import { findInviteByTokenHash } from "@/db/invites";
import { findOrganisation } from "@/db/organisations";
import { findUserByEmail } from "@/db/users";
import { hashToken } from "@/lib/council/invites";
import { resolveContext, type Context } from "@/lib/context";

/** What the join page shows before anyone signs in: whose invitation, to which address, and whether it still works. */
export async function describeInvite(token: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const invite = await findInviteByTokenHash(hashToken(token), q);
  if (!invite) return null;
  const org = await findOrganisation(invite.organisation_id, q);
  const expired = Date.parse(invite.expires_at) <= clock().getTime();
  return { email: invite.email, organisation: org?.name ?? "a council", status: expired && invite.status === "pending" ? ("expired" as const) : invite.status, has_account: !!(await findUserByEmail(invite.email, q)) };
}
