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

export interface InviteRow {
  id: string;
  organisation_id: string;
  email: string;
  token_hash: string;
  invited_by: string;
  status: "pending" | "accepted" | "revoked";
  expires_at: string;
  accepted_by: string | null;
  accepted_at: string | null;
  created_at: string;
}

export interface GiveawayDayRow {
  id: string;
  organisation_id: string;
  created_by: string;
  material_code: string;
  title: string;
  notes: string;
  date: string;
  time_zone: string;
  lat: number;
  lng: number;
  address: string;
  approx_lat: number;
  approx_lng: number;
  unit: "bags" | "m3";
  unit_size: number | null;
  household_cap: number;
  booking_opens_at: string;
  booking_closes_at: string;
  cancel_cutoff_hours: number;
  deposit_cents: number;
  currency: string;
  status: "scheduled" | "cancelled";
  cancel_reason: string | null;
  cancelled_at: string | null;
  created_at: string;
  updated_at: string;
}

export interface GiveawaySlotRow {
  id: string;
  day_id: string;
  starts_at: string;
  ends_at: string;
  capacity: number;
  booked: number;
  created_at: string;
}

export type BookingStatus = "booked" | "cancelled" | "checked_in" | "no_show";

export interface GiveawayBookingRow {
  id: string;
  day_id: string;
  slot_id: string;
  user_id: string;
  quantity: number;
  status: BookingStatus;
  deposit_cents: number;
  deposit_status: "none" | "recorded" | "released" | "forfeit";
  currency: string;
  checked_in_at: string | null;
  checked_in_by: string | null;
  cancelled_at: string | null;
  created_at: string;
  updated_at: string;
}

export type ReportReason = "contaminated" | "misdescribed" | "no_show" | "unsafe" | "other";

export interface ReportRow {
  id: string;
  reporter_id: string;
  subject_type: "listing" | "user";
  listing_id: string | null;
  subject_user_id: string | null;
  reason: ReportReason;
  text: string;
  status: "open" | "closed";
  outcome_note: string | null;
  closed_by: string | null;
  closed_at: string | null;
  created_at: string;
}

export interface GrowerShippingRow {
  user_id: string;
  ship_weekdays: string;
  paused: boolean | 0 | 1;
  pause_reason: "heat" | "frost" | "other" | null;
  pause_note: string | null;
  updated_at: string;
}
