// Row types, one place for every table's columns as stored.
import type { Role } from "@/lib/auth/roles";
import type { MaterialCode } from "@/lib/calc/facts";

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

export type ListingStatus = "draft" | "active" | "paused" | "archived" | "gone" | "expired" | "hidden";

export interface ListingRow {
  id: string;
  owner_id: string;
  organisation_id: string | null;
  material_code: MaterialCode;
  title: string;
  description: string;
  status: ListingStatus;
  unit: "sheets" | "m2" | "bags" | "m3" | "bales" | "kg";
  unit_size: number | null;
  unit_mass_kg: number | null;
  quantity_total: number;
  quantity_held: number;
  quantity_collected: number;
  price_cents: number;
  currency: string;
  deposit_cents: number;
  max_per_reservation: number | null;
  auto_accept: boolean | 0 | 1;
  /** Exact pickup point and address: never in a public response. */
  lat: number;
  lng: number;
  address: string;
  approx_lat: number;
  approx_lng: number;
  available_from: string | null;
  available_until: string | null;
  /** JSON text of the material's quality declarations. */
  quality: string;
  created_at: string;
  updated_at: string;
}

export interface ListingPhotoRow {
  id: string;
  listing_id: string;
  public_id: string;
  width: number;
  height: number;
  format: "jpg" | "png" | "webp";
  position: number;
  created_at: string;
}

export interface PickupWindowRow {
  id: string;
  listing_id: string;
  kind: "weekly" | "dated";
  weekday: number | null;
  start_time: string | null;
  end_time: string | null;
  starts_at: string | null;
  ends_at: string | null;
}
