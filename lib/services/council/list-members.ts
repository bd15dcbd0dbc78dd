import { membersOf } from "@/db/organisations";
import { resolveContext, type Context } from "@/lib/context";

/** The staff of a council, for its own members. */
export async function listMembers(organisationId: string, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return membersOf(organisationId, q);
}
