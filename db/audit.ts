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

export interface AuditSearch {
  action?: string;
  actor_id?: string;
  subject_type?: string;
  subject_id?: string;
  /** Keyset paging: rows older than this id. */
  before_id?: number;
  limit: number;
}

/** Newest first, with the actor's name; filters match exactly except `action`, which matches a prefix ("giveaway."). */
export async function searchAudit(s: AuditSearch, q: Db = db()): Promise<(AuditRow & { actor_name: string | null; actor_email: string | null; subject_name: string | null })[]> {
  // What the subject is called, for the log in words: a listing's title, a person's name, a day's title, a council's name.
  const query = q("audit_log as a")
    .leftJoin("users as u", "u.id", "a.actor_id")
    .leftJoin("listings as sl", (j) => j.on("sl.id", "a.subject_id").andOnVal("a.subject_type", "listing"))
    .leftJoin("users as su", (j) => j.on("su.id", "a.subject_id").andOnVal("a.subject_type", "user"))
    .leftJoin("giveaway_days as sg", (j) => j.on("sg.id", "a.subject_id").andOnVal("a.subject_type", "giveaway_day"))
    .leftJoin("organisations as so", (j) => j.on("so.id", "a.subject_id").andOnVal("a.subject_type", "organisation"))
    .select(
      "a.id",
      "a.actor_id",
      "a.action",
      "a.subject_type",
      "a.subject_id",
      "a.before",
      "a.after",
      "a.created_at",
      "u.display_name as actor_name",
      "u.email as actor_email",
      q.raw("coalesce(sl.title, su.display_name, sg.title, so.name) as subject_name"),
    );
  if (s.action) query.where("a.action", "like", `${s.action.replace(/[%_\\]/g, "")}%`);
  if (s.actor_id) query.where("a.actor_id", s.actor_id);
  if (s.subject_type) query.where("a.subject_type", s.subject_type);
  if (s.subject_id) query.where("a.subject_id", s.subject_id);
  if (s.before_id) query.where("a.id", "<", s.before_id);
  return query.orderBy("a.id", "desc").limit(s.limit);
}

/** The latest row of one action on a subject (e.g. the hide that a restore undoes). */
export async function lastAudit(subject_type: string, subject_id: string, action: string, q: Db = db()): Promise<AuditRow | undefined> {
  return q<AuditRow>("audit_log").first("*").where({ subject_type, subject_id, action }).orderBy("id", "desc");
}

/** Which of `actions` were taken on a subject since `since`, oldest first. */
export async function auditActionsSince(subject_type: string, subject_id: string, since: string, actions: string[], q: Db = db()): Promise<string[]> {
  const rows: { action: string }[] = await q("audit_log").select("action").where({ subject_type, subject_id }).andWhere("created_at", ">=", since).whereIn("action", actions).orderBy("id");
  return rows.map((r) => r.action);
}
