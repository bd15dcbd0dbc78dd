// Every e-mail the outbox can send, by the name a queued row carries in its `template` column.
// A service queues the name and the data the template needs (JSON, see db/outbox.ts); the
// deliverer renders the message when it sends it (lib/mail/deliver-outbox.ts). Data holds
// values already fixed when the mail was queued (labels, links, the day a date was worked
// out from), so a message rendered later reads exactly as it would have when queued.
import { alreadyJoinedEmail, confirmAddressEmail, passwordChangedEmail } from "./accounts";
import { bedReminderEmail } from "./bed-reminder";
import { councilInviteEmail } from "./council-invite";
import { cultureOrderEmail, type CultureMailInput, type CultureMailKind } from "./culture-orders";
import {
  giveawayBookedEmail,
  giveawayBookingCancelledEmail,
  giveawayBookingLapsedEmail,
  giveawayDayCancelledEmail,
  giveawayDepositReadyEmail,
} from "./giveaway";
import { needAlertEmail, needDigestEmail } from "./need-alerts";
import { reportOutcomeEmail } from "./report-outcome";
import { reservationEmail, type Audience, type MailExtra, type MailReservation, type ReservationMailKind } from "./reservations";

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

/** The data of a reservation e-mail: the reservation as the e-mail reads it, who it goes to, and the extras of its kind. */
export interface ReservationMailData {
  r: MailReservation;
  to: Audience;
  extra?: MailExtra;
  /** The app's address the links start with, where the mail was queued (the worker may not know it). */
  appUrl: string;
}

const RESERVATION_KINDS = [
  "requested",
  "confirmed",
  "declined",
  "cancelled",
  "expiring",
  "expired",
  "reminder",
  "no_show",
  "receipt",
  "message",
  "review_request",
  "returned",
  "returned_outside",
  "payment_ready",
] as const satisfies readonly ReservationMailKind[];

const CULTURE_KINDS = [
  "care_sheet",
  "order_confirmed",
  "packed",
  "shipped",
  "delivered",
  "posting_paused",
  "posting_resumed",
] as const satisfies readonly CultureMailKind[];

type ReservationTemplates = { [K in ReservationMailKind as `reservation.${K}`]: (d: ReservationMailData) => RenderedEmail };
type CultureTemplates = { [K in CultureMailKind as `culture.${K}`]: (d: CultureMailInput) => RenderedEmail };

const reservationTemplates = Object.fromEntries(
  RESERVATION_KINDS.map((kind) => [`reservation.${kind}`, (d: ReservationMailData) => reservationEmail(kind, d.r, d.to, d.extra ?? {}, d.appUrl)]),
) as ReservationTemplates;

const cultureTemplates = Object.fromEntries(CULTURE_KINDS.map((kind) => [`culture.${kind}`, (d: CultureMailInput) => cultureOrderEmail(kind, d)])) as CultureTemplates;

export const templates = {
  "account.confirm": (d: { name: string; url: string }) => confirmAddressEmail(d.name, d.url),
  "account.already_joined": (d: { signInUrl: string }) => alreadyJoinedEmail(d.signInUrl),
  "account.password_changed": (d: { signInUrl: string }) => passwordChangedEmail(d.signInUrl),
  bed_reminder: bedReminderEmail,
  council_invite: councilInviteEmail,
  report_outcome: reportOutcomeEmail,
  giveaway_booked: giveawayBookedEmail,
  giveaway_booking_cancelled: giveawayBookingCancelledEmail,
  giveaway_booking_lapsed: giveawayBookingLapsedEmail,
  giveaway_deposit_ready: giveawayDepositReadyEmail,
  giveaway_day_cancelled: giveawayDayCancelledEmail,
  "need.alert": needAlertEmail,
  "need.digest": needDigestEmail,
  ...reservationTemplates,
  ...cultureTemplates,
} satisfies Record<string, (data: never) => RenderedEmail>;

export type TemplateName = keyof typeof templates;
/** The data a template renders from, as it is queued. */
export type TemplateData<N extends TemplateName> = Parameters<(typeof templates)[N]>[0];

const BOOKING = ["name", "title", "organisation", "dateLabel", "slotLabel", "quantityLabel", "pageUrl"] as const;
const RESERVATION_DATA = ["r", "to", "appUrl"] as const;
const CULTURE_DATA = ["r", "to", "species", "shipping", "postingDay", "appUrl"] as const;

/** What each template's data must hold (null is a value; a missing key is not), checked before rendering. */
const REQUIRED: { [N in TemplateName]: readonly (keyof TemplateData<N>)[] } = {
  "account.confirm": ["name", "url"],
  "account.already_joined": ["signInUrl"],
  "account.password_changed": ["signInUrl"],
  bed_reminder: ["name", "bedName", "title", "date", "url"],
  council_invite: ["organisation", "inviter", "url", "expires"],
  report_outcome: ["name", "subject", "reason", "outcome", "actions"],
  giveaway_booked: [...BOOKING, "address", "cancelBy", "depositNote", "calendarUrl", "cautions"],
  giveaway_booking_cancelled: BOOKING,
  giveaway_booking_lapsed: [...BOOKING, "holdMinutes"],
  giveaway_deposit_ready: [...BOOKING, "holdMinutes"],
  giveaway_day_cancelled: [...BOOKING, "reason", "depositNote"],
  "need.alert": ["name", "line", "cautions", "needsUrl"],
  "need.digest": ["name", "lines", "needsUrl"],
  ...(Object.fromEntries(RESERVATION_KINDS.map((kind) => [`reservation.${kind}`, RESERVATION_DATA])) as { [K in keyof ReservationTemplates]: typeof RESERVATION_DATA }),
  ...(Object.fromEntries(CULTURE_KINDS.map((kind) => [`culture.${kind}`, CULTURE_DATA])) as { [K in keyof CultureTemplates]: typeof CULTURE_DATA }),
};

export function isTemplateName(name: string): name is TemplateName {
  return Object.prototype.hasOwnProperty.call(templates, name);
}

/**
 * Renders a queued message from its template's name and data. Throws when the name is not a
 * template or the data does not fit it: the deliverer records that on the row and gives up
 * on it, since trying again cannot change the outcome.
 */
export function renderTemplate(name: string, data: unknown): RenderedEmail {
  if (!isTemplateName(name)) throw new Error(`unknown e-mail template "${name}"`);
  if (typeof data !== "object" || data === null || Array.isArray(data)) throw new Error(`e-mail template "${name}" needs an object of data`);
  const missing = (REQUIRED[name] as readonly string[]).filter((key) => (data as Record<string, unknown>)[key] === undefined);
  if (missing.length) throw new Error(`e-mail template "${name}" needs ${missing.join(", ")} in its data`);
  return (templates[name] as (d: unknown) => RenderedEmail)(data);
}
