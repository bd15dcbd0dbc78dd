// The e-mails of a live-culture order: the care sheet sent on purchase, and the parcel's
// steps (confirmed, packed, shipped, delivered), and the word to a buyer waiting on a parcel
// when the grower pauses posting for the weather or resumes it. Built from the same parts as
// every other e-mail (renderEmail); facts come from lib/calc/facts.ts with their sources.
import { formatMoney } from "@/lib/format/money";
import type { MailReservation } from "./reservations";
import { WORM_DAILY_FOOD_SHARE, WORM_DAILY_FOOD_SOURCE, WORM_TEMPERATURE_F, WORMS_AFTER_DAYS } from "@/lib/calc/facts";
import { PAUSE_REASON_LABELS } from "@/lib/validation/grower";
import { dayLabel, estimatedWorms } from "@/lib/reservations/culture-orders";
import { whatLabel } from "@/lib/reservations/labels";
import { renderEmail, type EmailParts } from "../layout";
import type { Audience } from "./reservations";

export type CultureMailKind = "care_sheet" | "order_confirmed" | "packed" | "shipped" | "delivered" | "posting_paused" | "posting_resumed";

export interface CultureMailInput {
  r: MailReservation;
  to: Audience;
  /** As the grower names it on the listing. */
  species: string | null;
  /** The grower's posting days ("Monday", "Tuesday") and whether posting is paused, with the notice buyers read. */
  shipping: { ship_days: string[]; paused: boolean; notice: string; pause_reason?: "heat" | "frost" | "other" | null; pause_note?: string | null };
  /** The next posting day (YYYY-MM-DD), or null. */
  postingDay: string | null;
  /** The app's address the links start with, as it was where the mail was queued. */
  appUrl: string;
}

const fToC = (f: number) => Math.round(((f - 32) * 5) / 9);
const kg = (x: number) => `${Math.round(x * 100) / 100} kg`;
const T = WORM_TEMPERATURE_F;

/** The care sheet's paragraphs, in the order a new keeper needs them. */
export function careSheetParagraphs(r: MailReservation, species: string | null): string[] {
  const qty = r.quantity; // worm listings are sold by the kilogram
  const posted = r.fulfilment === "post";
  return [
    `What you have: ${whatLabel(r)}${species ? `, ${species}` : ""}, about ${estimatedWorms(qty).toLocaleString("en-GB")} worms (roughly 1,000 a pound; an estimate, not a count).`,
    ...(posted
      ? ["When the parcel comes: open it straight away, somewhere shaded. Cold, sluggish worms liven up at room temperature; dry ones want a light misting, not a soak."]
      : ["Bring them home in a container with damp bedding, out of the sun and the cold, and go straight home."]),
    "Bedding moisture, by the squeeze test: keep it as damp as a wrung-out sponge. Squeeze a handful: a drop or two of water is right; if nothing comes, sprinkle in water; if it drips steadily, mix in dry shredded cardboard or leaves.",
    `Temperature: keep them at about ${T.comfortable_min}–${T.comfortable_max} °F (${fToC(T.comfortable_min)}–${fToC(T.comfortable_max)} °C). Extension guidance puts them at their best at ${T.best_min}–${T.best_max} °F (Virginia Cooperative Extension) and most active at ${T.comfortable_min}–75 °F (Oregon State University Extension). They survive roughly ${T.survive_min}–${T.survive_max} °F (${fToC(T.survive_min)}–${fToC(T.survive_max)} °C) for a while, but not a day in a hot car or a frozen shed: shade a bin in summer and bring it under cover before frost.`,
    `Feeding: settled worms can eat about half their body weight a day (${WORM_DAILY_FOOD_SOURCE}); for ${kg(qty)} of worms that is up to about ${kg(qty * WORM_DAILY_FOOD_SHARE)} of scraps a day. Start far lower while they settle in: a small handful of chopped vegetable and fruit scraps or coffee grounds, buried under the bedding, and more only once it has gone. No meat, dairy, oily or salty food.`,
    `Into a new bed: add them ${WORMS_AFTER_DAYS.min}–${WORMS_AFTER_DAYS.max} days after building it, once the layers have stopped warming up and are cool and damp right through (common practice). Tuck them under the top layer in a few spots, in the evening or on a dull day.`,
    `Some earthworm species are invasive in some regions and can harm woodland soils. ${species ? `Yours are ${species}: keep` : "Keep"} them in your beds and bins, never tip them out in woodland, and check your local rules before you use them outdoors.`,
    "General guidance, not advice for your site: local rules come first.",
  ];
}

function paidLine(r: MailReservation): string | null {
  return r.amount_cents > 0 ? `Paid: ${formatMoney(r.amount_cents, r.currency)}.` : null;
}

function goesOutLine(i: CultureMailInput): string {
  const grower = i.r.supplier.name;
  if (i.shipping.paused) return `${i.shipping.notice} ${i.to === "gardener" ? `${grower} posts it once posting resumes.` : "It goes out once you resume posting."}`;
  const days = i.shipping.ship_days.join(" and ");
  if (!i.postingDay) return `It goes out on ${i.to === "gardener" ? `${grower}'s` : "your"} next posting day.`;
  return i.to === "gardener"
    ? `It goes out on ${dayLabel(i.postingDay)} at the earliest: ${grower} posts on ${days}, so parcels do not sit in a depot.`
    : `Your next posting day: ${dayLabel(i.postingDay)} (you post on ${days}).`;
}

/**
 * What a buyer waiting on a parcel may do while posting is paused, as the policy allows it
 * (lib/reservations/policy.ts): the buyer may cancel until the grower packs it, and a posted
 * culture cancelled then is returned in full.
 */
function whileYouWaitLine(r: MailReservation): string {
  const grower = r.supplier.name;
  if (r.order_stage === "packed") return `${grower} has packed it already, so it can no longer be cancelled on the site; if you would rather not wait, ask ${grower} in the messages.`;
  const money =
    r.payment_state === "paid" && r.amount_cents > 0
      ? `, and the ${formatMoney(r.amount_cents, r.currency)} you paid is refunded in full`
      : r.payment_state === "authorised" && r.deposit_cents > 0
        ? `, and the ${formatMoney(r.deposit_cents, r.currency)} deposit held on your card is released`
        : "";
  return `If you would rather not wait, you can cancel the order on your reservations page until ${grower} packs it${money}.`;
}

function parts(kind: CultureMailKind, i: CultureMailInput): { subject: string; body: EmailParts } {
  const { r, to } = i;
  const what = whatLabel(r);
  // The grower works through orders on the dashboard; reviews live on Requests.
  const link = to === "gardener" || kind === "delivered" ? `${i.appUrl}/reservations/${r.id}` : `${i.appUrl}/grower#o-${r.id}`;
  const action = (label: string) => ({ label, url: link });
  const lines = (...xs: (string | null | undefined)[]) => xs.filter((x): x is string => !!x);
  switch (kind) {
    case "care_sheet":
      return {
        subject: `Care sheet: ${what}`,
        body: { heading: "Looking after your worms", paragraphs: careSheetParagraphs(r, i.species), action: action("See your order") },
      };
    case "order_confirmed":
      return to === "gardener"
        ? {
            subject: `Order confirmed: ${what}`,
            body: {
              heading: `${r.supplier.name} will post your worms`,
              paragraphs: lines(`Posted to: ${r.ship_to}`, goesOutLine(i), paidLine(r), "You get an e-mail when it is packed and another when it is posted, with the carrier and tracking.", `Contact: ${r.supplier.name}, ${r.supplier.email}`),
              action: action("See your order"),
            },
          }
        : {
            subject: `New order to post: ${what}`,
            body: {
              heading: `${r.gardener.name} ordered ${what}`,
              paragraphs: lines(`Post to: ${r.ship_to}`, goesOutLine(i), paidLine(r), "Mark it packed, then shipped with the carrier and tracking, on your Worm cultures page; the buyer is told at each step."),
              action: action("Open your orders"),
            },
          };
    case "packed":
      return {
        subject: `Packed: ${what}`,
        body: { heading: `${r.supplier.name} has packed your worms`, paragraphs: lines(goesOutLine(i), `Posted to: ${r.ship_to}`), action: action("See your order") },
      };
    case "shipped":
      return {
        subject: `Shipped: ${what}`,
        body: {
          heading: "Your worms are in the post",
          paragraphs: lines(
            `Carrier: ${r.carrier}`,
            `Tracking: ${r.tracking}`,
            `Posted to: ${r.ship_to}`,
            "Open the parcel as soon as it comes, somewhere shaded; the care sheet we sent has the rest. Once it has arrived, mark it delivered on your order.",
          ),
          action: action("See your order"),
        },
      };
    case "delivered":
      return {
        subject: `Delivered: ${what}`,
        body: {
          heading: to === "gardener" ? "Your worms have arrived" : `${r.gardener.name}'s worms have arrived`,
          paragraphs: [to === "gardener" ? `A line on how they arrived helps the next buyer choose a grower.` : "The order is complete. A line about the buyer helps other growers."],
          action: action(to === "gardener" ? "Rate the grower" : "Rate the buyer"),
        },
      };
    case "posting_paused": {
      const reason = PAUSE_REASON_LABELS[i.shipping.pause_reason ?? "other"];
      return {
        subject: `Posting paused: ${what}`,
        body: {
          heading: `${r.supplier.name} has paused posting because of ${reason}`,
          paragraphs: lines(
            `Worms are live animals and suffer in a hot or freezing parcel, so ${r.supplier.name} is holding back parcels until the weather turns.`,
            i.shipping.pause_note ? `${r.supplier.name}'s note: ${i.shipping.pause_note}` : null,
            `Your order (${what}, to ${r.ship_to}) waits with ${r.supplier.name} until posting resumes; we e-mail you when it does.`,
            whileYouWaitLine(r),
          ),
          action: action("See your order"),
        },
      };
    }
    case "posting_resumed":
      return {
        subject: `Posting again: ${what}`,
        body: { heading: `${r.supplier.name} is posting again`, paragraphs: lines(goesOutLine(i), `Posted to: ${r.ship_to}`), action: action("See your order") },
      };
  }
}

export function cultureOrderEmail(kind: CultureMailKind, input: CultureMailInput) {
  const { subject, body } = parts(kind, input);
  return renderEmail(subject, body);
}
