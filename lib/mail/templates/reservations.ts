// The e-mails of the reservation flow, in Duffbank's words. Each is built from the same
// parts as HTML and plain text (renderEmail). Times are in the town's time zone.
import { formatMoney } from "@/lib/format/money";
import type { ReservationContext } from "@/db/reservation-context";
import { appUrl } from "@/lib/env";
import { moneySentence, whatLabel, type MoneyOutcome } from "@/lib/reservations/labels";
import { formatLocal, windowLabel } from "@/lib/reservations/pickup-times";
import { renderEmail, type EmailParts } from "../layout";

export type ReservationMailKind =
  | "requested"
  | "confirmed"
  | "declined"
  | "cancelled"
  | "expiring"
  | "expired"
  | "reminder"
  | "no_show"
  | "receipt"
  | "message"
  | "review_request"
  | "returned"
  | "returned_outside"
  | "payment_ready";
export type Audience = "gardener" | "supplier";

/**
 * What the reservation e-mails read of a reservation: queued with the message as its data
 * (JSON), so the deliverer can render it later without reading the reservation again.
 */
export type MailReservation = Pick<
  ReservationContext,
  | "id"
  | "quantity"
  | "fulfilment"
  | "ship_to"
  | "pickup_at"
  | "pickup_by"
  | "hold_expires_at"
  | "pickup_code"
  | "amount_cents"
  | "deposit_cents"
  | "currency"
  | "payment_state"
  | "order_stage"
  | "carrier"
  | "tracking"
  | "window"
> & {
  listing: Pick<ReservationContext["listing"], "title" | "unit" | "address" | "auto_accept">;
  gardener: Pick<ReservationContext["gardener"], "name">;
  supplier: Pick<ReservationContext["supplier"], "name" | "email">;
};

/** The part of a reservation its e-mails need, to queue as data. */
export function reservationMailData(r: MailReservation): MailReservation {
  return {
    id: r.id,
    quantity: r.quantity,
    fulfilment: r.fulfilment,
    ship_to: r.ship_to,
    pickup_at: r.pickup_at,
    pickup_by: r.pickup_by,
    hold_expires_at: r.hold_expires_at,
    pickup_code: r.pickup_code,
    amount_cents: r.amount_cents,
    deposit_cents: r.deposit_cents,
    currency: r.currency,
    payment_state: r.payment_state,
    order_stage: r.order_stage,
    carrier: r.carrier,
    tracking: r.tracking,
    window: r.window,
    listing: { title: r.listing.title, unit: r.listing.unit, address: r.listing.address, auto_accept: r.listing.auto_accept },
    gardener: { name: r.gardener.name },
    supplier: { name: r.supplier.name, email: r.supplier.email },
  };
}

export interface MailExtra {
  reason?: string | null;
  money?: MoneyOutcome;
  cancelledBy?: Audience;
  message?: { author: string; body: string };
}

// One page per reservation serves both sides, however long their lists grow.
const link = (base: string, r: MailReservation) => `${base}/reservations/${r.id}`;

function whenLine(r: MailReservation): string {
  // A posted live culture has no pickup: say where it goes (lib/mail/templates/culture-orders.ts has its other e-mails).
  if (r.fulfilment === "post") return `Posted to: ${r.ship_to}`;
  if (r.window && r.pickup_at) return `When: ${windowLabel(r.window)} — yours is ${formatLocal(r.pickup_at)} to ${formatLocal(r.pickup_by!, undefined, { timeOnly: true })}.`;
  if (r.pickup_by) return `When: by arrangement through the messages on the reservation, before ${formatLocal(r.pickup_by)}.`;
  return "When: by arrangement through the messages on the reservation.";
}

function paidLine(r: MailReservation): string | null {
  if (r.amount_cents > 0) return `Paid: ${formatMoney(r.amount_cents, r.currency)}.`;
  if (r.deposit_cents > 0) return `No-show deposit: ${formatMoney(r.deposit_cents, r.currency)} on hold on the gardener's card, released at pickup.`;
  return null;
}

const carry = (r: MailReservation) =>
  r.listing.unit === "bales"
    ? "Bales are heavy: lift with your legs, keep the bale close, and share the lift with a second person."
    : "Bring gloves and bags or a tarp; wash your hands after handling soil, manure or compost.";

function parts(kind: ReservationMailKind, r: MailReservation, to: Audience, extra: MailExtra, base: string): { subject: string; body: EmailParts } {
  const what = whatLabel(r);
  const money = extra.money ? moneySentence(r, extra.money) : null;
  const reason = extra.reason ? `Their note: “${extra.reason}”` : null;
  const action = (label: string) => ({ label, url: link(base, r) });
  const lines = (...xs: (string | null | undefined)[]) => xs.filter((x): x is string => !!x);
  switch (kind) {
    case "requested":
      return to === "supplier"
        ? {
            subject: `New request: ${what}`,
            body: {
              heading: `${r.gardener.name} would like ${what}`,
              paragraphs: lines(
                whenLine(r),
                paidLine(r),
                r.hold_expires_at ? `Accept or decline by ${formatLocal(r.hold_expires_at)}. After that the hold runs out and the quantity goes back on your listing.` : null,
              ),
              action: action("Answer the request"),
            },
          }
        : {
            subject: `Request sent: ${what}`,
            body: {
              heading: `We have passed your request to ${r.supplier.name}`,
              paragraphs: [
                r.fulfilment === "post"
                  ? "You will get an e-mail as soon as they accept, with the day it goes in the post."
                  : "You will get an e-mail as soon as they accept. The exact pickup address and your pickup code come with it.",
              ],
              action: action("See your reservation"),
            },
          };
    case "confirmed":
      return to === "gardener"
        ? {
            subject: `Confirmed: ${what} — pickup code ${r.pickup_code}`,
            body: {
              heading: "Your pickup is confirmed",
              paragraphs: lines(
                `Where: ${r.listing.address}`,
                whenLine(r),
                `Your pickup code: ${r.pickup_code}. Give it to ${r.supplier.name} when you collect.`,
                `Contact: ${r.supplier.name}, ${r.supplier.email}`,
                carry(r),
              ),
              action: action("See your reservation"),
            },
          }
        : {
            subject: `${r.listing.auto_accept ? "New reservation" : "You accepted"}: ${what}`,
            body: {
              heading: `${r.gardener.name} is collecting ${what}`,
              paragraphs: lines(
                r.listing.auto_accept ? "Your listing accepts requests automatically, so this one is already confirmed." : null,
                whenLine(r),
                paidLine(r),
                "They will give you a pickup code: enter it on the request (or mark it collected) when they have been.",
              ),
              action: action("Open the request"),
            },
          };
    case "declined":
      return {
        subject: `Declined: ${what}`,
        body: { heading: `${r.supplier.name} cannot give you this one`, paragraphs: lines(reason, money, "Other listings nearby may still have what your bed needs."), action: { label: "Find other material", url: `${base}/beds` } },
      };
    case "cancelled": {
      const byYou = extra.cancelledBy === to;
      const who = extra.cancelledBy === "gardener" ? r.gardener.name : r.supplier.name;
      return {
        subject: `Cancelled: ${what}`,
        body: {
          heading: byYou ? "You cancelled this reservation" : `${who} cancelled this reservation`,
          paragraphs: lines(byYou ? null : reason, to === "gardener" ? money : null, to === "supplier" ? "The quantity is back on your listing." : null),
          action: action("See the details"),
        },
      };
    }
    case "expiring":
      return to === "gardener"
        ? {
            subject: `Your hold ends soon: ${what}`,
            body: { heading: `Finish paying by ${formatLocal(r.hold_expires_at!)} to keep it`, paragraphs: ["After that the hold runs out and the material goes back to the listing."], action: action("Pay now") },
          }
        : {
            subject: `Waiting for your answer: ${what}`,
            body: { heading: `${r.gardener.name}'s request runs out at ${formatLocal(r.hold_expires_at!)}`, paragraphs: lines(paidLine(r), "Accept or decline it before then."), action: action("Answer the request") },
          };
    case "expired":
      return {
        subject: `Hold ran out: ${what}`,
        body: {
          heading: to === "gardener" ? "Your hold ran out" : "A request ran out unanswered",
          paragraphs: lines(to === "gardener" ? money : null, to === "gardener" ? "You can reserve it again if some is still there." : "The quantity is back on your listing."),
          action: action("See the details"),
        },
      };
    case "reminder":
      if (!r.pickup_at) {
        // No fixed time: the reminder comes the day before the last day to collect.
        return to === "gardener"
          ? { subject: `Collect by tomorrow: ${what}`, body: { heading: "Your pickup is due by tomorrow", paragraphs: lines(`Where: ${r.listing.address}`, whenLine(r), `Pickup code: ${r.pickup_code}.`, "Not coming after all? Cancel it, so someone else can have it.", carry(r)), action: action("See your reservation") } }
          : { subject: `Due by tomorrow: ${r.gardener.name} collects ${what}`, body: { heading: "A pickup is due by tomorrow", paragraphs: lines(whenLine(r)), action: action("Open the request") } };
      }
      return to === "gardener"
        ? { subject: `Tomorrow: collect ${what}`, body: { heading: "Your pickup is tomorrow", paragraphs: lines(`Where: ${r.listing.address}`, whenLine(r), `Pickup code: ${r.pickup_code}.`, carry(r)), action: action("See your reservation") } }
        : { subject: `Tomorrow: ${r.gardener.name} collects ${what}`, body: { heading: "A pickup is due tomorrow", paragraphs: lines(whenLine(r)), action: action("Open the request") } };
    case "no_show":
      return {
        subject: `Not collected: ${what}`,
        body: {
          heading: to === "gardener" ? `${r.supplier.name} marked this as not collected` : "You recorded a no-show",
          paragraphs: lines(to === "gardener" ? money : null, to === "gardener" ? "If that is a mistake, reply to them through the reservation's messages." : "The quantity is back on your listing."),
          action: action("See the details"),
        },
      };
    case "receipt":
      return r.amount_cents > 0
        ? { subject: `Receipt: ${formatMoney(r.amount_cents, r.currency)} for ${what}`, body: { heading: "Thank you: your payment is through", paragraphs: [`${formatMoney(r.amount_cents, r.currency)} for ${what}, from ${r.supplier.name}.`, "If the supplier declines or cancels, or you cancel in good time, it is refunded in full."], action: action("See your reservation") } }
        : { subject: `Deposit on hold: ${formatMoney(r.deposit_cents, r.currency)} for ${what}`, body: { heading: "Your no-show deposit is on hold", paragraphs: [`${formatMoney(r.deposit_cents, r.currency)} is reserved on your card, not taken.`, "It is released when you collect or cancel in good time, and kept only if you do not come."], action: action("See your reservation") } };
    case "message":
      return {
        subject: `New message about ${what}`,
        body: { heading: `${extra.message!.author} wrote`, paragraphs: [extra.message!.body, "Reply on Duffbank; replying to this e-mail does not reach them."], action: action("Reply") },
      };
    case "review_request":
      return {
        subject: `Collected: how did it go? ${what}`,
        body: {
          heading: to === "gardener" ? `Rate ${r.supplier.name}` : `Rate ${r.gardener.name}`,
          paragraphs: [to === "gardener" ? "A line on what the material was like helps the next gardener choose." : "A line on how the pickup went helps other givers."],
          action: action("Leave a review"),
        },
      };
    case "payment_ready":
      return {
        subject: `Your payment page is ready: ${what}`,
        body: {
          heading: `Pay by ${formatLocal(r.hold_expires_at!)} to keep it`,
          paragraphs: [
            "The payment page could not be opened when you reserved. It is open now, and we have renewed the hold so you have time to pay.",
            `${r.supplier.name} hears about your request once the payment is through.`,
          ],
          action: action("Pay now"),
        },
      };
    case "returned":
      return { subject: `Money returned: ${what}`, body: { heading: "Your payment came in after the hold had ended", paragraphs: lines(moneySentence(r, "returned")), action: action("See the details") } };
    case "returned_outside":
      return {
        subject: `Cancelled: ${what}`,
        body: {
          heading: r.amount_cents > 0 ? "The payment was refunded, so this reservation is cancelled" : "The deposit hold was released, so this reservation is cancelled",
          paragraphs: lines(
            "The money went back through the card payment service, not through Duffbank, so the reservation cannot go on.",
            to === "gardener" ? moneySentence(r, "returned") : "The quantity is back on your listing.",
            to === "gardener" ? "Still want it? Reserve it again while it is listed." : null,
          ),
          action: action("See the details"),
        },
      };
  }
}

/** `base`: the app's address the links start with, as it was where the mail was queued. */
export function reservationEmail(kind: ReservationMailKind, r: MailReservation, to: Audience, extra: MailExtra = {}, base = appUrl()) {
  const { subject, body } = parts(kind, r, to, extra, base);
  return renderEmail(subject, body);
}
