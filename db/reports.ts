import { db, newId, nowIso, type Db } from "./index";
import type { ReportReason, ReportRow } from "./types";

const COLUMNS = ["id", "reporter_id", "subject_type", "listing_id", "subject_user_id", "reason", "text", "status", "outcome_note", "closed_by", "closed_at", "created_at"];

export async function insertReport(row: Pick<ReportRow, "reporter_id" | "subject_type" | "listing_id" | "subject_user_id" | "reason" | "text">, q: Db = db()): Promise<ReportRow> {
  const full = { id: newId(), ...row, status: "open", created_at: nowIso() };
  await q("reports").insert(full);
  return (await findReport(full.id, q))!;
}

export async function findReport(id: string, q: Db = db()): Promise<ReportRow | undefined> {
  return (await q("reports").first(COLUMNS).where({ id })) as ReportRow | undefined;
}

export async function reportsSince(reporterId: string, sinceIso: string, q: Db = db()): Promise<number> {
  const [{ n }] = await q("reports").where({ reporter_id: reporterId }).andWhere("created_at", ">=", sinceIso).count({ n: "*" });
  return Number(n);
}

export async function closeReportRow(id: string, moderatorId: string, note: string, q: Db = db()): Promise<number> {
  return q("reports").where({ id, status: "open" }).update({ status: "closed", outcome_note: note, closed_by: moderatorId, closed_at: nowIso() });
}

export interface QueueRow {
  id: string;
  subject_type: "listing" | "user";
  reason: ReportReason;
  text: string;
  status: "open" | "closed";
  outcome_note: string | null;
  created_at: string;
  closed_at: string | null;
  reporter_id: string;
  reporter_name: string;
  reporter_email: string;
  listing_id: string | null;
  listing_title: string | null;
  listing_status: string | null;
  subject_user_id: string | null;
  subject_name: string | null;
  subject_email: string | null;
  subject_suspended_at: string | null;
  subject_verified_at: string | null;
  reports_on_subject: number;
}

/** Reports with what a moderator needs to judge them: who reported, the listing and its owner, the person. */
export async function reportQueue(status: "open" | "closed" | "all", q: Db = db()): Promise<QueueRow[]> {
  // Repeat reports about the same person or listing are a signal in themselves.
  const sameSubject = q("reports as r2")
    .count("*")
    .where((w) => w.whereRaw("r2.listing_id = r.listing_id").orWhereRaw("(r2.listing_id IS NULL AND r.listing_id IS NULL AND r2.subject_user_id = r.subject_user_id)"))
    .as("reports_on_subject");
  const query = q("reports as r")
    .join("users as rep", "rep.id", "r.reporter_id")
    .leftJoin("listings as l", "l.id", "r.listing_id")
    .leftJoin("users as s", "s.id", "r.subject_user_id")
    .select(
      "r.id",
      "r.subject_type",
      "r.reason",
      "r.text",
      "r.status",
      "r.outcome_note",
      "r.created_at",
      "r.closed_at",
      "r.reporter_id",
      "rep.display_name as reporter_name",
      "rep.email as reporter_email",
      "r.listing_id",
      "l.title as listing_title",
      "l.status as listing_status",
      "r.subject_user_id",
      "s.display_name as subject_name",
      "s.email as subject_email",
      "s.suspended_at as subject_suspended_at",
      "s.verified_at as subject_verified_at",
      sameSubject,
    );
  if (status !== "all") query.where("r.status", status);
  return query.orderBy([{ column: "r.created_at", order: status === "open" ? "asc" : "desc" }, { column: "r.id" }]).limit(200);
}
