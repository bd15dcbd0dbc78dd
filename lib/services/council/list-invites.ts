import "server-only";
import { pendingInvites } from "@/db/invites";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { InviteView, inviteView } from "@/lib/council/invites";
import { resolveContext, type Context } from "@/lib/context";

export async function listInvites(staff: CouncilStaff, ctx: Context = {}): Promise<InviteView[]> {
  const { db: q, clock } = resolveContext(ctx);
  return (await pendingInvites(staff.organisationId, clock().toISOString(), q)).map(inviteView);
}
