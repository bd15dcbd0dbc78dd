import { rolesOf } from "@/db/users";
import { growerShipping } from "@/lib/services/growers/get-grower-shipping";
import { resolveContext, type Context } from "@/lib/context";

/** A grower's posting days and pause, for buyers; null when the account is not an active grower. */
export async function getPublicShipping(growerId: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const roles = await rolesOf(growerId, q);
  if (!roles.some((r) => r.role === "grower" && r.status === "active")) return null;
  return growerShipping(growerId, { db: q, clock });
}
