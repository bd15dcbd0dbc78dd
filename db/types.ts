// Row types, one place for every table's columns as stored.
import type { Role } from "@/lib/auth/roles";
import type { MaterialCode } from "@/lib/calc/facts";
import type { ListingStatus } from "@/lib/listings/status";

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
  /** Where this gardener plans from when a bed has no place of its own (private). */
  home_place: string | null;
  home_lat: number | null;
  home_lng: number | null;
  created_at: string;
  updated_at: string;
}

export interface PlaceRow {
  id: string;
  kind: "town" | "village" | "postcode" | "street" | "landmark";
  name: string;
  context: string | null;
  lat: number;
  lng: number;
  created_at: string;
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
  /** Null until sent for a message queued as template data; set for one queued rendered (before migration 033). */
  subject: string | null;
  text_body: string | null;
  html_body: string | null;
  template: string;
  /** The template's data as JSON (lib/mail/templates/index.ts), rendered when sent; null on a row queued rendered. */
  data: string | null;
  dedupe_key: string | null;
  status: "pending" | "sent" | "failed";
  attempts: number;
  next_attempt_at: string;
  last_error: string | null;
  created_at: string;
  sent_at: string | null;
  /** Set while one worker is sending it; others leave it alone until then. */
  claimed_until: string | null;
  /** The worker holding the claim, so it can let go of its claims when it stops. */
  claimed_by: string | null;
  /** The id the SMTP server accepted the message under: once set, it is never sent again. */
  smtp_message_id: string | null;
  /** "smtp" while a retry waits for the mail server to answer again. */
  waiting_for: "smtp" | null;
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

export type { ListingStatus };

/** A listing's quality declarations (herbicide history, leaf source, a culture's species …). */
export type ListingQuality = Record<string, unknown>;

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
  /** Sold by the pack (live cultures): the pack's size in the listing's unit and its price; both or neither. */
  pack_size: number | null;
  pack_price_cents: number | null;
  auto_accept: boolean | 0 | 1;
  /** Exact pickup point and address: never in a public response. */
  lat: number;
  lng: number;
  address: string;
  approx_lat: number;
  approx_lng: number;
  available_from: string | null;
  available_until: string | null;
  /** The material's quality declarations: stored as JSON text, parsed once as the row is read (db/listings.ts). */
  quality: ListingQuality;
  /** When the listing is next due to be checked against open needs; null: nothing to do (migrations/20261208_020_open_needs.ts). */
  needs_due_at?: string | null;
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

export interface ReservationRow {
  id: string;
  listing_id: string;
  gardener_id: string;
  bed_id: string | null;
  pickup_window_id: string | null;
  group_id: string | null;
  quantity: number;
  status: "held" | "confirmed" | "collected" | "declined" | "cancelled" | "expired" | "no_show";
  payment_state: "none" | "awaiting" | "unpaid" | "paid" | "authorised" | "released" | "captured" | "refunded";
  hold_expires_at: string | null;
  pickup_code: string | null;
  pickup_at: string | null;
  pickup_by: string | null;
  amount_cents: number;
  deposit_cents: number;
  currency: string;
  confirmed_at: string | null;
  closed_at: string | null;
  cancelled_by: "gardener" | "supplier" | null;
  expiry_warned_at: string | null;
  /** A request waiting for the supplier: when the half-way reminder is due (lib/reservations/policy.ts). */
  answer_remind_at: string | null;
  pickup_reminded_at: string | null;
  /** Live cultures only: collected or posted (lib/reservations/culture-orders.ts). */
  fulfilment: "pickup" | "post" | null;
  /** The address a posted culture goes to: the buyer's and the grower's eyes only. */
  ship_to: string | null;
  order_stage: "paid" | "packed" | "shipped" | "delivered" | "collected" | null;
  carrier: string | null;
  tracking: string | null;
  shipped_at: string | null;
  /** The open need it was reserved for (from an alert), counted towards meeting it. */
  need_id: string | null;
  created_at: string;
  updated_at: string;
}

export interface PaymentRow {
  id: string;
  // Exactly one owner: a reservation, or a giveaway booking's no-show deposit (lib/payments/owner.ts).
  reservation_id: string | null;
  giveaway_booking_id: string | null;
  parent_id: string | null;
  kind: "payment" | "deposit" | "refund";
  provider: string;
  provider_ref: string | null; // checkout session id, or refund id
  payment_intent_id: string | null;
  checkout_url: string | null;
  // creating | open | expired | authorised | paid | released | captured | refunded (refunds: pending | succeeded | failed)
  status: string;
  amount_cents: number;
  captured_cents: number;
  refunded_cents: number;
  currency: string;
  idempotency_key: string;
  last_error: string | null;
  // "open": the checkout could not be made when it was asked for; the worker makes it.
  pending_action: "open" | "expire" | "release" | "capture" | "refund" | null;
  action_attempts: number;
  next_action_at: string | null;
  /** "stripe" while the owed call waits for Stripe to answer again. */
  waiting_for: "stripe" | null;
  created_at: string;
  updated_at: string;
}

export interface ReservationEventRow {
  id: number;
  reservation_id: string;
  from_status: string | null;
  to_status: string;
  actor_id: string | null;
  note: string | null;
  created_at: string;
}

export interface ReservationMessageRow {
  id: string;
  reservation_id: string;
  author_id: string;
  body: string;
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
export type DepositStatus = "none" | "awaiting" | "held" | "released" | "kept" | "unpaid";

export interface GiveawayBookingRow {
  id: string;
  day_id: string;
  slot_id: string;
  user_id: string;
  quantity: number;
  status: BookingStatus;
  deposit_cents: number;
  // none: the day asks none; awaiting: the card page is open (until hold_expires_at); held: on
  // the card; released: the hold let go; kept: captured for a no-show; unpaid: never put down.
  deposit_status: DepositStatus;
  currency: string;
  hold_expires_at: string | null;
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

export type NeedStatus = "open" | "met" | "expired" | "closed";

/** An open need; lat and lng are its owner's alone (aggregates use the demand grid's cells). */
export interface NeedRow {
  id: string;
  owner_id: string;
  bed_id: string | null;
  material_code: MaterialCode;
  /** SI, in `unit`. */
  quantity: number;
  unit: "m2" | "m3" | "kg";
  radius_km: number;
  reach_km: number;
  lat: number;
  lng: number;
  /** YYYY-MM-DD. */
  needed_by: string;
  alerts: "daily" | "immediate";
  status: NeedStatus;
  closed_at: string | null;
  created_at: string;
  updated_at: string;
}

export interface NeedAlertRow {
  id: string;
  need_id: string;
  listing_id: string;
  user_id: string;
  distance_km: number;
  /** How the e-mail goes: at once, in the day's digest, or none (in_app: found as the need was opened, while its owner was in the app). */
  delivery: "daily" | "immediate" | "in_app";
  emailed_at: string | null;
  seen_at: string | null;
  dismissed_at: string | null;
  created_at: string;
}
