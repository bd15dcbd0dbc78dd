import { renderEmail } from "../layout";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { longDate, wallTime } from "@/lib/time/zoned";

export interface BookingParts {
  name: string;
  title: string;
  organisation: string;
  dateLabel: string;
  slotLabel: string;
  quantityLabel: string;
  pageUrl: string;
}

/** The words every giveaway-booking e-mail shares: who, which day, which slot, how much. */
export function bookingParts(p: {
  name: string;
  organisation: string;
  pageUrl: string;
  day: { title: string; date: string; time_zone: string; unit: "bags" | "m3" };
  slot: { starts_at: string; ends_at: string };
  quantity: number;
}): BookingParts {
  return {
    name: p.name,
    title: p.day.title,
    organisation: p.organisation,
    dateLabel: longDate(p.day.date),
    slotLabel: `${wallTime(p.slot.starts_at, p.day.time_zone)}–${wallTime(p.slot.ends_at, p.day.time_zone)}`,
    quantityLabel: formatGiveawayQuantity(p.quantity, p.day.unit),
    pageUrl: p.pageUrl,
  };
}

/** Booked: the exact place (only booked households see it), the cut-off, and the calendar file. */
export function giveawayBookedEmail(p: BookingParts & { address: string; cancelBy: string; depositNote: string | null; calendarUrl: string; cautions: string[] }) {
  return renderEmail(`Booked: ${p.title}, ${p.dateLabel} ${p.slotLabel}`, {
    heading: `You're booked for ${p.title}`,
    paragraphs: [
      `Hello ${p.name}, ${p.organisation} has your household down for ${p.quantityLabel} on ${p.dateLabel}, arriving ${p.slotLabel}.`,
      `Where: ${p.address}. Bring your own bags or a trailer, and gloves.`,
      `You can cancel on Duffbank until ${p.cancelBy}; that frees the place for another household. Your booking page: ${p.pageUrl}`,
      ...(p.depositNote ? [p.depositNote] : []),
      ...p.cautions,
    ],
    action: { label: "Add it to your calendar (.ics)", url: p.calendarUrl },
  });
}

export function giveawayBookingCancelledEmail(p: BookingParts & { depositNote?: string | null }) {
  return renderEmail(`Cancelled: your booking for ${p.title}`, {
    heading: "Your booking is cancelled",
    paragraphs: [
      `Hello ${p.name}, your booking for ${p.quantityLabel} at ${p.title} (${p.organisation}) on ${p.dateLabel}, ${p.slotLabel}, is cancelled. The place has gone back to other households.`,
      ...(p.depositNote ? [p.depositNote] : []),
    ],
    action: { label: "See other giveaway days", url: p.pageUrl },
  });
}

/** The no-show deposit was not put down within the hold: the booking lapsed. */
export function giveawayBookingLapsedEmail(p: BookingParts & { holdMinutes: number }) {
  return renderEmail(`Not booked: ${p.title}, ${p.dateLabel}`, {
    heading: "Your booking lapsed",
    paragraphs: [
      `Hello ${p.name}, the no-show deposit for your place at ${p.title} (${p.organisation}) on ${p.dateLabel}, ${p.slotLabel}, was not put down within ${p.holdMinutes} minutes, so the place has gone back to other households. Nothing was taken from your card.`,
      "You can book again while places are left.",
    ],
    action: { label: "See the day", url: p.pageUrl },
  });
}

/** The deposit's card page could not be opened at booking; the worker has opened it now. */
export function giveawayDepositReadyEmail(p: BookingParts & { holdMinutes: number }) {
  return renderEmail(`Put your deposit down: ${p.title}, ${p.dateLabel}`, {
    heading: "The deposit page is open now",
    paragraphs: [
      `Hello ${p.name}, the card page for the no-show deposit on your place at ${p.title} (${p.organisation}) on ${p.dateLabel}, ${p.slotLabel}, could not be opened when you booked. It is open now.`,
      `Your place is held for another ${p.holdMinutes} minutes while you put the deposit down from the day's page.`,
    ],
    action: { label: "Put the deposit down", url: p.pageUrl },
  });
}

/** The council called the day off: everyone booked hears, with the deposit released. */
export function giveawayDayCancelledEmail(p: BookingParts & { reason: string; depositNote: string }) {
  return renderEmail(`Called off: ${p.title} on ${p.dateLabel}`, {
    heading: `${p.title} is called off`,
    paragraphs: [
      `Hello ${p.name}, ${p.organisation} has cancelled the giveaway day on ${p.dateLabel}. Your booking (${p.quantityLabel}, ${p.slotLabel}) is cancelled with it.`,
      `Their reason: ${p.reason}`,
      p.depositNote,
    ],
    action: { label: "See other giveaway days", url: p.pageUrl },
  });
}
