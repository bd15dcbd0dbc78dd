import { pendingRoleRequests } from "@/db/organisations";
import { resolveContext, type Context } from "@/lib/context";

/** Requests for a role that wait for a moderator's decision. */
export async function listRoleRequests(ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return pendingRoleRequests(q);
}
