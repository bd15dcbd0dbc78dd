import type { Db } from "@/db/index";
import { enqueueEmail } from "@/db/outbox";
import type { ReservationContext } from "@/db/reservation-context";
import { reservationEmail, type Audience, type MailExtra, type ReservationMailKind } from "./templates/reservations";

/**
 * Writes a reservation e-mail to the outbox, inside the caller's transaction, so the mail
 * exists exactly when the change does. The dedupe key makes a replayed change (a webhook
 * delivered twice, a job run twice) keep one message.
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
    const mail = reservationEmail(kind, r, to, extra);
    await enqueueEmail(
      { to: person.email, ...mail, template: `reservation.${kind}`, dedupe_key: `res:${r.id}:${kind}:${to}${key ? `:${key}` : ""}` },
      q,
    );
  }
}
