import type { Db } from "@/db/index";
import { enqueueEmail } from "@/db/outbox";
import { appUrl } from "@/lib/env";
import type { ReservationContext } from "@/db/reservation-context";
import { reservationMailData, type Audience, type MailExtra, type ReservationMailKind } from "./templates/reservations";

/**
 * Queues a reservation e-mail in the outbox, inside the caller's transaction, so the mail
 * exists exactly when the change does: its template and data, rendered when it is sent. The
 * dedupe key makes a replayed change (a webhook delivered twice, a job run twice) keep one
 * message.
 */
export async function mailReservation(
  q: Db,
  kind: ReservationMailKind,
  r: ReservationContext,
  audiences: Audience[],
  extra: MailExtra = {},
  key = "",
): Promise<void> {
  for (const to of audiences) {
    const person = to === "gardener" ? r.gardener : r.supplier;
    await enqueueEmail(
      { to: person.email, template: `reservation.${kind}`, data: { r: reservationMailData(r), to, extra, appUrl: appUrl() }, dedupe_key: `res:${r.id}:${kind}:${to}${key ? `:${key}` : ""}` },
      q,
    );
  }
}
