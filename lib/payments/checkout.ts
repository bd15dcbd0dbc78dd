import "server-only";
import { db, nowIso, type Db } from "@/db/index";
import { findPayment } from "@/db/payments";
import { reservationContext } from "@/db/reservation-context";
import { appUrl } from "@/lib/app-url";
import { whatLabel } from "@/lib/reservations/labels";
import { stripe } from "./stripe";

// A Checkout Session (mode payment) for one reservation: automatic capture for a price,
// manual capture for a deposit (an authorisation hold). Created after the hold commits,
// with the payment row's idempotency key, so a retry returns the same session.

// Stripe lets a session live from 30 minutes to 24 hours; Duffbank closes it itself when
// the hold ends, so the session only needs to outlast the hold.
const SESSION_MIN_S = 31 * 60;
const SESSION_MAX_S = 23 * 60 * 60;

export async function startCheckout(paymentId: string, clock: () => Date = () => new Date(), q: Db = db()): Promise<string | null> {
  const payment = await findPayment(paymentId, q);
  if (!payment || payment.kind === "refund") return null;
  if (payment.status === "open") return payment.checkout_url;
  if (payment.status !== "creating") return null;
  const r = await reservationContext(payment.reservation_id, q);
  if (!r || r.status !== "held") return null;

  const nowS = Math.floor(clock().getTime() / 1000);
  const holdS = r.hold_expires_at ? Math.floor(new Date(r.hold_expires_at).getTime() / 1000) : 0;
  const expiresAt = Math.min(nowS + SESSION_MAX_S, Math.max(nowS + SESSION_MIN_S, holdS + 60));
  const deposit = payment.kind === "deposit";
  const metadata = { reservation_id: r.id, payment_id: payment.id, kind: payment.kind };
  const what = whatLabel(r);
  const session = await stripe().checkout.sessions.create(
    {
      mode: "payment",
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: payment.currency,
            unit_amount: payment.amount_cents,
            product_data: { name: deposit ? `Refundable no-show deposit: ${what}` : what },
          },
        },
      ],
      success_url: `${appUrl()}/reservations/paid?session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${appUrl()}/reservations?checkout=cancelled#r-${r.id}`,
      client_reference_id: r.id,
      customer_email: r.gardener.email,
      metadata,
      payment_intent_data: {
        capture_method: deposit ? "manual" : "automatic",
        metadata,
        description: deposit ? `Duffbank deposit for reservation ${r.id}` : `Duffbank reservation ${r.id}`,
      },
      expires_at: expiresAt,
    },
    { idempotencyKey: payment.idempotency_key },
  );
  const n = await q("payments")
    .where({ id: payment.id, status: "creating" })
    .update({ provider_ref: session.id, checkout_url: session.url, status: "open", updated_at: nowIso(clock) });
  if (n === 0) {
    // The hold ended while the session was being made: close it again so nobody pays for nothing.
    await stripe().checkout.sessions.expire(session.id).catch(() => undefined);
    return null;
  }
  return session.url;
}
