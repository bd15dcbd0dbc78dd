// The audit log in words: who did what to what ("Mara Quill hid the listing “Bagged oak
// leaves”"), with the values before and after as plain "field: value" lines for those who open
// the details. The stored codes and ids stay in the database and the API; people read this.

export interface AuditLine {
  action: string;
  subject_type: string;
  subject_id: string | null;
  subject_name?: string | null;
  actor_name: string | null;
}

/** What an action did, as a verb phrase; "{it}" is the subject in words. */
const DID: Record<string, string> = {
  "listing.hide": "hid {it}",
  "listing.restore": "showed {it} again",
  "listing.publish": "published {it}",
  "listing.pause": "paused {it}",
  "listing.resume": "resumed {it}",
  "listing.archive": "archived {it}",
  "listing.create": "posted {it}",
  "listing.update": "changed {it}",
  "user.suspend": "suspended {it}",
  "user.restore": "lifted the suspension of {it}",
  "user.verify": "verified {it} as a supplier",
  "user.unverify": "removed the verified badge from {it}",
  "role.granted": "granted a role to {it}",
  "role.requested": "asked for a role for {it}",
  "role.approve": "approved a role for {it}",
  "role.refuse": "turned down a role for {it}",
  "report.close": "closed {it}",
  "council.invite": "invited someone to join {it}",
  "council.invite_revoke": "withdrew an invitation to {it}",
  "council.member_add": "joined {it}",
  "council.member_remove": "removed someone from {it}",
  "giveaway.create": "created {it}",
  "giveaway.update": "changed {it}",
  "giveaway.cancel": "called off {it}",
  "giveaway.slots_add": "added time slots to {it}",
  "giveaway.slot_resize": "changed how many households {it} takes",
  "giveaway.slot_remove": "removed {it}",
  "giveaway.attendance_checked_in": "checked in {it}",
  "giveaway.attendance_no_show": "recorded {it} as not come",
  "giveaway.attendance_booked": "undid the check-in of {it}",
  "grower.culture": "changed the culture details of {it}",
  "grower.shipping": "changed the posting days of {it}",
};

const KIND: Record<string, string> = {
  listing: "the listing",
  user: "the account",
  report: "a report",
  organisation: "the council",
  giveaway_day: "the giveaway day",
  giveaway_slot: "a time slot",
  giveaway_booking: "a household's booking",
};

/** "the listing “Bagged oak leaves”", "the account of Mara Quill", "a time slot". */
export function subjectWords(l: Pick<AuditLine, "subject_type" | "subject_name">): string {
  const kind = KIND[l.subject_type] ?? "something";
  if (!l.subject_name) return kind;
  if (l.subject_type === "user") return l.subject_name;
  if (l.subject_type === "listing" || l.subject_type === "giveaway_day") return `${kind} “${l.subject_name}”`;
  if (l.subject_type === "organisation") return l.subject_name;
  return `${kind} (${l.subject_name})`;
}

/** "Mara Quill hid the listing “Bagged oak leaves”". */
export function auditSentence(l: AuditLine): string {
  const it = subjectWords(l);
  const pattern = DID[l.action];
  const did = pattern ? pattern.replace("{it}", it) : `${l.action.split(".").pop()!.replace(/_/g, " ")} on ${it}`;
  return `${l.actor_name ?? "Duffbank"} ${did}`;
}

const FIELD_WORDS: Record<string, string> = {
  status: "Status",
  note: "Note",
  title: "Title",
  report_id: "Report",
  suspended_at: "Suspended",
  verified_at: "Verified",
  role: "Role",
  org_role: "Council role",
  email: "E-mail",
  capacity: "Households per slot",
  starts_at: "Starts",
  ends_at: "Ends",
  ship_weekdays: "Posting days",
  paused: "Posting paused",
};

const readable = (v: unknown): string => {
  if (v === null || v === undefined || v === "") return "—";
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (Array.isArray(v)) return v.map(readable).join(", ");
  if (typeof v === "object") return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${FIELD_WORDS[k] ?? k.replace(/_/g, " ")} ${readable(x)}`).join("; ");
  return String(v).replace(/_/g, " ");
};

/** A stored before/after value as "Field: value" lines; an unreadable one as it was stored. */
export function changeLines(json: string | null): { field: string; value: string }[] {
  if (!json) return [];
  let parsed: unknown;
  try {
    parsed = JSON.parse(json);
  } catch {
    return [{ field: "Value", value: json }];
  }
  if (Array.isArray(parsed)) return [{ field: "Fields", value: parsed.map((k) => FIELD_WORDS[String(k)] ?? String(k).replace(/_/g, " ")).join(", ") }];
  if (parsed && typeof parsed === "object") return Object.entries(parsed as Record<string, unknown>).map(([k, v]) => ({ field: FIELD_WORDS[k] ?? k.charAt(0).toUpperCase() + k.slice(1).replace(/_/g, " "), value: readable(v) }));
  return [{ field: "Value", value: readable(parsed) }];
}
