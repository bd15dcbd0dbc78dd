import { rolesOf } from "@/db/users";
import { growerShipping } from "@/lib/services/growers/get-grower-shipping";

/** A grower's posting days and pause, for buyers; null when the account is not an active grower. */
export async function getPublicShipping(growerId: string) {
  const roles = await rolesOf(growerId);
  if (!roles.some((r) => r.role === "grower" && r.status === "active")) return null;
  return growerShipping(growerId);
}
