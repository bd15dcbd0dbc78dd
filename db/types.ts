// Row types, one place for every table's columns as stored.
import type { Role } from "@/lib/auth/roles";

export interface UserRow {
  id: string;
  email: string;
  email_verified_at: string | null;
  password_hash: string | null;
  display_name: string;
  unit_system: "metric" | "imperial";
  reminders_opt_out: boolean | 0 | 1;
  suspended_at: string | null;
  verified_at: string | null;
  created_at: string;
  updated_at: string;
}

export interface UserRoleRow {
  user_id: string;
  role: Role;
  status: "active" | "requested" | "refused";
  created_at: string;
}

export interface OrganisationRow {
  id: string;
  name: string;
  kind: "council" | "business";
  created_at: string;
}

export interface MembershipRow {
  organisation_id: string;
  user_id: string;
  org_role: "owner" | "staff";
  created_at: string;
}

export interface OutboxRow {
  id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  template: string;
  dedupe_key: string | null;
  status: "pending" | "sent" | "failed";
  attempts: number;
  next_attempt_at: string;
  last_error: string | null;
  created_at: string;
  sent_at: string | null;
}

export interface AuditRow {
  id: number;
  actor_id: string | null;
  action: string;
  subject_type: string;
  subject_id: string | null;
  before: string | null;
  after: string | null;
  created_at: string;
}
