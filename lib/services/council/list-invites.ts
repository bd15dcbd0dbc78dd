import "server-only";
import { pendingInvites } from "@/db/invites";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { InviteView, inviteView } from "@/lib/council/invites";

export async function listInvites(ctx: CouncilStaff, clock: () => Date = () => new Date()): Promise<InviteView[]> {
  return (await pendingInvites(ctx.organisationId, clock().toISOString())).map(inviteView);
}
