import { searchAudit as findAudit, type AuditSearch } from "@/db/audit";
import { resolveContext, type Context } from "@/lib/context";

/** The audit trail for moderators, newest first, filtered as asked. */
export async function searchAudit(search: AuditSearch, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return findAudit(search, q);
}
