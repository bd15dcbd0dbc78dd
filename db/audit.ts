import { db, nowIso, type Db } from "./index";
import type { AuditRow } from "./types";

export interface AuditEntry {
  actor_id: string | null;
  action: string;
  subject_type: string;
  subject_id?: string | null;
  before?: unknown;
  after?: unknown;
}

/** Append one row. There is no update or delete: the table's triggers refuse both. */
export async function recordAudit(entry: AuditEntry, q: Db = db()): Promise<void> {
  await q("audit_log").insert({
    actor_id: entry.actor_id,
    action: entry.action,
    subject_type: entry.subject_type,
    subject_id: entry.subject_id ?? null,
    before: entry.before === undefined ? null : JSON.stringify(entry.before),
    after: entry.after === undefined ? null : JSON.stringify(entry.after),
    created_at: nowIso(),
  });
}

export async function auditFor(subject_type: string, subject_id: string, q: Db = db()): Promise<AuditRow[]> {
  return q<AuditRow>("audit_log").select("*").where({ subject_type, subject_id }).orderBy("id");
}
