import type { Db } from "@/db/index";
import { findShipping } from "@/db/grower-shipping";
import { enqueueEmail } from "@/db/outbox";
import { appUrl } from "@/lib/env";
import type { ReservationContext } from "@/db/reservation-context";
import { nextPostingDay } from "@/lib/reservations/culture-orders";
import { shippingView } from "@/lib/growers/view";
import type { CultureMailKind } from "./templates/culture-orders";
import { reservationMailData, type Audience } from "./templates/reservations";
import { listingQuality } from "@/db/listings";
import type { ListingQuality } from "@/db/types";

/**
 * Writes a live-culture order e-mail to the outbox inside the caller's transaction (like
 * mailReservation). The dedupe key keeps one care sheet per order however often the
 * payment webhook or the confirmation runs; `key` names one occurrence of a mail that may
 * rightly come again (one pause of posting and the next).
 */
export async function mailCultureOrder(q: Db, kind: CultureMailKind, r: ReservationContext, audiences: Audience[], now: Date, key?: string): Promise<void> {
  const [shippingRow, quality] = await Promise.all([findShipping(r.listing.owner_id, q), listingQuality(r.listing_id, q)]);
  const { ship_weekdays, ...shipping } = shippingView(shippingRow); // the mails name the days; the numbers stay here
  const species = speciesOf(quality);
  const postingDay = shipping.paused ? null : nextPostingDay(ship_weekdays, now);
  for (const to of audiences) {
    const person = to === "gardener" ? r.gardener : r.supplier;
    // The posting day is worked out from `now` here, so the mail says what it said when queued.
    const data = { r: reservationMailData(r), to, species, shipping, postingDay, appUrl: appUrl() };
    await enqueueEmail({ to: person.email, template: `culture.${kind}`, data, dedupe_key: `order:${r.id}:${kind}:${to}${key ? `:${key}` : ""}` }, q);
  }
}

function speciesOf(v: ListingQuality): string | null {
  return typeof v.species === "string" && v.species.trim() ? v.species.trim() : null;
}
