import "server-only";
import type { Knex } from "knex";
import type Stripe from "stripe";
import { isUniqueViolation } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { db } from "@/db/index";
import { findPayment, paymentByStripeRef, updatePayment } from "@/db/payments";
import type { PaymentRow } from "@/db/types";
import { runPaymentActions } from "@/lib/payments/actions";
import { lockOwner, ownerOf } from "@/lib/payments/owner";
import { bookingDepositFollows } from "@/lib/services/giveaway-deposit";
import { gardenerStepDone, moneyReturnedOutside } from "@/lib/services/reservation-steps";

// Applies one event of Stripe's record, exactly once: the event id goes into webhook_events
// in the same transaction as its effects, so a repeat finds the id and changes nothing, and a
// failure rolls both back. A payment's status only moves forward (by RANK).
// Only events built from Stripe's own record reach here: lib/payments/reconcile.ts
// (syncPayment) reads the checkout back through the SDK and feeds what it shows through here
// as the events it implies, whether a webhook asked it to (receive-stripe-event.ts), a Stripe
// call Duffbank made, or the worker looking for lost webhooks. A webhook's own body is never
// applied, so a correctly signed but false event changes nothing.

const RANK: Record<string, number> = { creating: 0, open: 0, expired: 1, authorised: 2, paid: 3, released: 4, captured: 4, refunded: 5 };

type Target = { status?: keyof typeof RANK; patch?: Partial<PaymentRow> };

const str = (v: unknown) => (typeof v === "string" ? v : v && typeof v === "object" && "id" in v ? String((v as { id: string }).id) : null);

function targetFor(event: Stripe.Event, row: PaymentRow): Target | null {
  const obj = event.data.object as unknown as Record<string, any>;
  switch (event.type) {
    case "checkout.session.completed": {
      const intent = str(obj.payment_intent);
      return { status: obj.payment_status === "paid" ? "paid" : "authorised", patch: intent ? { payment_intent_id: intent } : {} };
    }
    case "checkout.session.expired":
      return { status: "expired" };
    case "payment_intent.amount_capturable_updated":
      return obj.amount_capturable > 0 ? { status: "authorised", patch: { payment_intent_id: obj.id } } : null;
    case "payment_intent.succeeded":
      return row.kind === "deposit"
        ? { status: "captured", patch: { payment_intent_id: obj.id, captured_cents: obj.amount_received } }
        : { status: "paid", patch: { payment_intent_id: obj.id, captured_cents: obj.amount_received } };
    case "payment_intent.canceled": {
      // A hold let go (by Duffbank, or on Stripe's side) held money once; an abandoned or
      // declined checkout's intent never did. The record carries the charge to tell which.
      const charge = obj.latest_charge as { status?: string } | string | null;
      const held = !!charge && typeof charge === "object" && charge.status === "succeeded";
      return { status: held ? "released" : "expired", patch: { payment_intent_id: obj.id } };
    }
    case "payment_intent.payment_failed":
      return { patch: { payment_intent_id: obj.id, last_error: String(obj.last_payment_error?.message ?? "The card was declined.").slice(0, 500) } };
    case "charge.refunded": {
      if (!obj.captured || !(obj.amount_refunded > 0)) return null; // a released hold, handled by payment_intent.canceled
      const refunded = Math.max(row.refunded_cents, obj.amount_refunded);
      return { status: refunded >= obj.amount_captured ? "refunded" : undefined, patch: { refunded_cents: refunded } };
    }
    default:
      return null;
  }
}

class DuplicateEvent extends Error {
  constructor() {
    super("this event was applied before");
  }
}

export async function applyStripeEvent(event: Stripe.Event, deps: { db?: Knex; clock?: () => Date } = {}): Promise<"applied" | "duplicate"> {
  const q = deps.db ?? db();
  const now = (deps.clock ?? (() => new Date()))();
  const at = now.toISOString();
  let owed: string[] = [];
  try {
    owed = await writeTransaction(q, async (trx) => {
      // First statement: the write that makes a second delivery of this event a no-op. Only
      // a conflict on this insert means "seen before"; any other failure below rolls back
      // and reaches Stripe as a 500, so the event is delivered again rather than dropped.
      try {
        await trx("webhook_events").insert({ id: event.id, provider: "stripe", type: event.type, created_at: new Date(event.created * 1000).toISOString(), processed_at: at });
      } catch (err) {
        if (isUniqueViolation(err)) throw new DuplicateEvent();
        throw err;
      }
      const obj = event.data.object as unknown as Record<string, any>;
      const isSession = event.type.startsWith("checkout.session.");
      const isIntent = event.type.startsWith("payment_intent.");
      const found = await paymentByStripeRef(
        {
          payment_id: obj.metadata?.payment_id,
          session_id: isSession ? obj.id : null,
          intent_id: isIntent ? obj.id : str(obj.payment_intent),
        },
        trx,
      );
      if (!found || found.kind === "refund") return [];
      // Two events about one payment can arrive at once (a completed checkout and its intent's
      // update). Lock what it pays for, then the payment, and decide on the row as it is now:
      // the second waits for the first and then sees its status, so it cannot undo it.
      await lockOwner(trx, found);
      const row = (await findPayment(found.id, trx, { lock: true }))!;
      const target = targetFor(event, row);
      if (!target) return [];
      const forward = target.status !== undefined && RANK[target.status] > RANK[row.status];
      await updatePayment(row.id, { ...target.patch, ...(forward ? { status: target.status } : {}), updated_at: at }, trx);
      if (!forward) return [];
      return ownerFollows(trx, row, target.status!, now);
    });
  } catch (err) {
    if (err instanceof DuplicateEvent) return "duplicate";
    throw err;
  }
  await runPaymentActions(owed, deps.clock, q);
  return "applied";
}

/** What the payment pays for follows it: a reservation, or a giveaway booking's deposit. */
async function ownerFollows(trx: Knex.Transaction, row: PaymentRow, status: string, now: Date): Promise<string[]> {
  const owner = ownerOf(row);
  if (owner.type === "giveaway_booking") return bookingDepositFollows(trx, row, status, now);
  return reservationFollows(trx, row, owner.id, status, now);
}

/** The reservation side of a payment moving forward. */
async function reservationFollows(trx: Knex.Transaction, row: PaymentRow, reservationId: string, status: string, now: Date): Promise<string[]> {
  const was = RANK[row.status];
  const owed: string[] = [];
  if (was < RANK.authorised && (status === "authorised" || status === "paid")) {
    owed.push(...(await gardenerStepDone(trx, reservationId, row.kind === "deposit" ? "authorised" : "paid", now)));
  }
  if (["released", "captured", "refunded"].includes(status)) {
    await trx("reservations").where({ id: reservationId }).update({ payment_state: status, updated_at: now.toISOString() });
    if (status !== "captured") owed.push(...(await moneyReturnedOutside(trx, reservationId, status as "released" | "refunded", now)));
  }
  return owed;
}
