import { searchAudit as findAudit, type AuditSearch } from "@/db/audit";

/** The audit trail for moderators, newest first, filtered as asked. */
export async function searchAudit(search: AuditSearch) {
  return findAudit(search);
}
