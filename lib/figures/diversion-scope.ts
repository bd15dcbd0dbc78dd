import "server-only";
import type { SessionUser } from "@/lib/auth/current-user";
import type { DiversionScope } from "@/db/diversion";

/** A person's own listings, and their organisation's listings and giveaway days when they are staff. */
export function diversionScopeOf(user: SessionUser): DiversionScope {
  return { userId: user.id, organisationId: user.organisation?.id ?? null };
}
