import { describe, expect, it } from "vitest";
import type Stripe from "stripe";
import type { PaymentRow } from "@/db/types";
import type { CheckoutRecord } from "@/lib/payments/gateway";
import { expectedStatus, impliedEvents, movesForward, recordMismatches, targetFor } from "@/lib/payments/status";

// The pure rules of a payment's status (lib/payments/status.ts), without a database or Stripe.

const row = (over: Partial<PaymentRow> = {}) =>
  ({ id: "pay_1", kind: "payment", status: "open", amount_cents: 450, currency: "eur", refunded_cents: 0, ...over }) as PaymentRow;

const event = (type: string, object: Record<string, unknown>) => ({ id: `evt_${type}`, type, created: 0, data: { object } }) as unknown as Stripe.Event;

const record = (over: { session?: object; intent?: object | null; charge?: object | null } = {}): CheckoutRecord =>
  ({
    session: { id: "cs_1", status: "complete", amount_total: 450, currency: "eur", payment_intent: "pi_1", metadata: { payment_id: "pay_1" }, ...over.session },
    intent: over.intent === null ? null : { id: "pi_1", status: "succeeded", amount: 450, currency: "eur", amount_received: 450, ...over.intent },
    charge: over.charge === null ? null : { id: "ch_1", status: "succeeded", captured: true, amount_captured: 450, amount_refunded: 0, ...over.charge },
  }) as unknown as CheckoutRecord;

describe("which status may follow which", () => {
  it("only ever moves a payment forward", () => {
    expect(movesForward("open", "authorised")).toBe(true);
    expect(movesForward("authorised", "captured")).toBe(true);
    expect(movesForward("paid", "authorised")).toBe(false);
    expect(movesForward("released", "captured")).toBe(false); // two ends of one hold: the first stays
    expect(movesForward("refunded", "paid")).toBe(false);
    expect(movesForward("open", undefined)).toBe(false);
  });
});

describe("what an event says", () => {
  it("tells a paid checkout from an authorised deposit", () => {
    expect(targetFor(event("checkout.session.completed", { payment_status: "paid", payment_intent: "pi_1" }), row())).toEqual({ status: "paid", patch: { payment_intent_id: "pi_1" } });
    expect(targetFor(event("checkout.session.completed", { payment_status: "unpaid", payment_intent: { id: "pi_2" } }), row({ kind: "deposit" }))).toEqual({ status: "authorised", patch: { payment_intent_id: "pi_2" } });
  });

  it("calls a succeeded deposit captured and a succeeded payment paid", () => {
    expect(targetFor(event("payment_intent.succeeded", { id: "pi_1", amount_received: 300 }), row({ kind: "deposit" }))?.status).toBe("captured");
    expect(targetFor(event("payment_intent.succeeded", { id: "pi_1", amount_received: 300 }), row())?.status).toBe("paid");
  });

  it("calls a cancelled intent released only when it held money", () => {
    expect(targetFor(event("payment_intent.canceled", { id: "pi_1", latest_charge: { status: "succeeded" } }), row())?.status).toBe("released");
    expect(targetFor(event("payment_intent.canceled", { id: "pi_1", latest_charge: { status: "failed" } }), row())?.status).toBe("expired");
    expect(targetFor(event("payment_intent.canceled", { id: "pi_1", latest_charge: "ch_1" }), row())?.status).toBe("expired");
  });

  it("refunds in full only when the whole capture came back, and ignores a released hold's charge", () => {
    expect(targetFor(event("charge.refunded", { captured: true, amount_refunded: 200, amount_captured: 450 }), row())).toEqual({ status: undefined, patch: { refunded_cents: 200 } });
    expect(targetFor(event("charge.refunded", { captured: true, amount_refunded: 450, amount_captured: 450 }), row())?.status).toBe("refunded");
    expect(targetFor(event("charge.refunded", { captured: false, amount_refunded: 450, amount_captured: 0 }), row())).toBeNull();
  });

  it("changes nothing for an event it does not know", () => {
    expect(targetFor(event("customer.created", {}), row())).toBeNull();
  });
});

describe("what Stripe's record says", () => {
  it("reads the status a checkout's record implies", () => {
    expect(expectedStatus(row(), record({ session: { status: "open" }, intent: null, charge: null }))).toBe("open");
    expect(expectedStatus(row({ kind: "deposit" }), record({ intent: { status: "requires_capture" } }))).toBe("authorised");
    expect(expectedStatus(row({ kind: "deposit" }), record())).toBe("captured");
    expect(expectedStatus(row(), record({ charge: { amount_refunded: 450 } }))).toBe("refunded");
    expect(expectedStatus(row(), record({ intent: { status: "canceled" } }))).toBe("released");
  });

  it("refuses a record of another amount, currency or payment", () => {
    expect(recordMismatches(row(), record())).toEqual([]);
    expect(recordMismatches(row(), record({ session: { amount_total: 1 } }))).toContain("the checkout is for 1, not 450");
    expect(recordMismatches(row(), record({ session: { currency: "usd" }, intent: { currency: "usd" } }))).toHaveLength(2);
    expect(recordMismatches(row(), record({ session: { metadata: { payment_id: "pay_2" } } }))).toEqual(["the checkout belongs to payment pay_2"]);
  });

  it("implies the events in order, each named by what it says", () => {
    const ids = impliedEvents(record({ session: { id: "cs_1" } }), new Date(0)).map((e) => e.id);
    expect(ids).toEqual(["recovered:checkout.session.completed:cs_1", "recovered:payment_intent.succeeded:pi_1"]);
  });

  it("implies only the return when the money came back before Duffbank saw it arrive", () => {
    const back = record({ intent: { status: "canceled" } });
    expect(impliedEvents(back, new Date(0), false).map((e) => e.type)).toEqual(["payment_intent.canceled"]);
    expect(impliedEvents(back, new Date(0), true).map((e) => e.type)).toEqual(["checkout.session.completed", "payment_intent.canceled"]);
  });
});
