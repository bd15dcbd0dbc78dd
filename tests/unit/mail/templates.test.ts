// Queued e-mails hold a template's name and data (JSON) and are rendered when sent. What the
// reader gets must not depend on that: rendered from the queued data, every message reads
// byte for byte as it would have rendered from the full reservation at the time it was queued.
import { describe, expect, it } from "vitest";
import type { ReservationContext } from "@/db/reservation-context";
import { appUrl } from "@/lib/env";
import { cultureOrderEmail, type CultureMailKind } from "@/lib/mail/templates/culture-orders";
import { renderTemplate, templates } from "@/lib/mail/templates";
import { reservationEmail, reservationMailData, type Audience, type MailExtra, type ReservationMailKind } from "@/lib/mail/templates/reservations";

const base: ReservationContext = {
  id: "res-1",
  listing_id: "lst-1",
  gardener_id: "u-g",
  bed_id: null,
  pickup_window_id: "w-1",
  group_id: null,
  quantity: 3,
  status: "confirmed",
  payment_state: "paid",
  hold_expires_at: "2027-01-09T10:30:00.000Z",
  pickup_code: "K7QP",
  pickup_at: "2027-01-10T09:00:00.000Z",
  pickup_by: "2027-01-10T10:00:00.000Z",
  amount_cents: 1250,
  deposit_cents: 0,
  currency: "gbp",
  confirmed_at: "2027-01-08T08:00:00.000Z",
  closed_at: null,
  cancelled_by: null,
  expiry_warned_at: null,
  answer_remind_at: null,
  pickup_reminded_at: null,
  fulfilment: null,
  ship_to: null,
  order_stage: null,
  carrier: null,
  tracking: null,
  shipped_at: null,
  need_id: null,
  created_at: "2027-01-08T07:00:00.000Z",
  updated_at: "2027-01-08T08:00:00.000Z",
  listing: {
    id: "lst-1",
    title: "Oak leaves from Hollin Lane",
    material_code: "leaves",
    unit: "bags",
    unit_size: 60,
    unit_mass_kg: 4,
    auto_accept: false,
    owner_id: "u-s",
    organisation_id: null,
    address: "14 Hollin Lane, Marrowby",
    lat: 53.1,
    lng: -1.2,
    approx_lat: 53.1,
    approx_lng: -1.2,
  },
  gardener: { id: "u-g", name: "Wren Tallis", email: "wren@example.test", reminders_opt_out: false },
  supplier: { id: "u-s", name: "Ossie Brant", email: "ossie@example.test", verified: true },
  window: { id: "w-1", listing_id: "lst-1", kind: "dated", weekday: null, start_time: null, end_time: null, starts_at: "2027-01-10T09:00:00.000Z", ends_at: "2027-01-10T12:00:00.000Z" },
};

const posted: ReservationContext = {
  ...base,
  id: "res-2",
  fulfilment: "post",
  ship_to: "2 Mill Row, Marrowby",
  order_stage: "shipped",
  carrier: "Royal Mail",
  tracking: "RM123",
  pickup_at: null,
  pickup_by: null,
  window: null,
  listing: { ...base.listing, unit: "kg", title: "Red wigglers" },
};

const deposit: ReservationContext = { ...base, id: "res-3", amount_cents: 0, deposit_cents: 500, payment_state: "authorised", pickup_at: null, window: null, listing: { ...base.listing, auto_accept: true, unit: "bales" } };

const RESERVATION_KINDS: ReservationMailKind[] = [
  "requested", "confirmed", "declined", "cancelled", "expiring", "expired", "reminder",
  "no_show", "receipt", "message", "review_request", "returned", "returned_outside", "payment_ready",
];
const CULTURE_KINDS: CultureMailKind[] = ["care_sheet", "order_confirmed", "packed", "shipped", "delivered", "posting_paused", "posting_resumed"];
const AUDIENCES: Audience[] = ["gardener", "supplier"];
const EXTRAS: MailExtra[] = [
  { reason: "Rain all week", money: "returned", cancelledBy: "supplier", message: { author: "Ossie Brant", body: "Gate code 4411" } },
  { reason: null, money: "kept", cancelledBy: "gardener", message: { author: "Wren Tallis", body: "<b>Running late</b>" } },
];

// What a row holds: the data as JSON, read back as the deliverer reads it.
const queued = (data: unknown) => JSON.parse(JSON.stringify(data));

describe("e-mail templates rendered from queued data", () => {
  it("renders every reservation e-mail from its data exactly as from the full reservation", () => {
    for (const r of [base, posted, deposit])
      for (const kind of RESERVATION_KINDS)
        for (const to of AUDIENCES)
          for (const extra of EXTRAS) {
            const direct = reservationEmail(kind, r, to, extra);
            expect(renderTemplate(`reservation.${kind}`, queued({ r: reservationMailData(r), to, extra, appUrl: appUrl() })), `${r.id} ${kind} ${to}`).toEqual(direct);
          }
  });

  it("renders every culture-order e-mail from its data exactly as from the full reservation", () => {
    const shipping = { ship_days: ["Monday", "Tuesday"], paused: false, notice: "Parcels go out on Monday and Tuesday.", pause_reason: null, pause_note: null };
    const pausedShipping = { ...shipping, paused: true, notice: "Posting is paused because of heat.", pause_reason: "heat" as const, pause_note: "Back when it cools" };
    for (const s of [shipping, pausedShipping])
      for (const kind of CULTURE_KINDS)
        for (const to of AUDIENCES) {
          const input = { r: posted, to, species: "Eisenia fetida", shipping: s, postingDay: s.paused ? null : "2027-01-11", appUrl: appUrl() };
          const direct = cultureOrderEmail(kind, input);
          expect(renderTemplate(`culture.${kind}`, queued({ ...input, r: reservationMailData(posted) })), `${kind} ${to}`).toEqual(direct);
        }
  });

  it("starts its links with the app's address queued in the data, not the delivering process's", () => {
    const at = "https://beds.marrowby.test";
    const mail = renderTemplate("reservation.confirmed", queued({ r: reservationMailData(base), to: "gardener", appUrl: at }));
    expect(mail.text).toContain(`${at}/reservations/res-1`);
    const shipping = { ship_days: ["Monday"], paused: false, notice: "", pause_reason: null, pause_note: null };
    const culture = renderTemplate("culture.order_confirmed", queued({ r: reservationMailData(posted), to: "supplier", species: null, shipping, postingDay: null, appUrl: at }));
    expect(culture.text).toContain(`${at}/grower#o-res-2`);
    expect(appUrl()).not.toBe(at);
  });

  it("keeps only what the e-mails read of a reservation in its data", () => {
    const data = reservationMailData(base) as unknown as Record<string, unknown>;
    expect(data).not.toHaveProperty("gardener_id");
    expect(data).not.toHaveProperty("listing.lat");
    expect(data).not.toHaveProperty("gardener.email");
  });

  it("has a template for every name services queue", () => {
    expect(Object.keys(templates)).toEqual(
      expect.arrayContaining([
        "account.confirm", "account.already_joined", "account.password_changed", "bed_reminder", "council_invite", "report_outcome",
        "giveaway_booked", "giveaway_booking_cancelled", "giveaway_booking_lapsed", "giveaway_deposit_ready", "giveaway_day_cancelled",
        "need.alert", "need.digest",
        ...RESERVATION_KINDS.map((k) => `reservation.${k}`),
        ...CULTURE_KINDS.map((k) => `culture.${k}`),
      ]),
    );
  });

  it("refuses an unknown template and data that is not an object", () => {
    expect(() => renderTemplate("reservation.unheard_of", {})).toThrow(/unknown e-mail template/);
    expect(() => renderTemplate("account.confirm", null)).toThrow(/object of data/);
    expect(() => renderTemplate("reservation.confirmed", { to: "gardener" })).toThrow('e-mail template "reservation.confirmed" needs r, appUrl in its data');
    expect(() => renderTemplate("council_invite", { organisation: "Marrowby Council", inviter: "Ada Fenn", url: "http://x.test" })).toThrow(/needs expires/);
    // null is a value some data holds on purpose (no posting day while posting is paused).
    const shipping = { ship_days: ["Monday"], paused: true, notice: "Posting is paused.", pause_reason: "heat", pause_note: null };
    expect(renderTemplate("culture.posting_paused", queued({ r: reservationMailData(posted), to: "gardener", species: null, shipping, postingDay: null, appUrl: appUrl() })).subject).toBe("Posting paused: 3 kg of Red wigglers");
  });
});
