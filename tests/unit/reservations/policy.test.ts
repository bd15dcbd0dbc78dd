import { describe, expect, it } from "vitest";
import {
  MIN_ANSWER_MINUTES,
  SUPPLIER_REPLY_HOURS,
  allowedActions,
  answerDeadline,
  answerReminderAt,
  blockedReason,
  cancellationIsTimely,
  earliestPickupStart,
  holdFor,
  holdMinutes,
  holdWaitFor,
} from "@/lib/reservations/policy";
import { moneySentence, quantityLabel } from "@/lib/reservations/labels";
import { priceFor } from "@/lib/payments/money";

const now = new Date("2026-12-01T12:00:00Z");
const hoursFromNow = (h: number) => new Date(now.getTime() + h * 3_600_000).toISOString();

describe("reservation policy", () => {
  it("offers the supplier accept, decline and cancel on a held request, the gardener only cancel", () => {
    const held = { status: "held" as const, payment_state: "none" as const, pickup_by: hoursFromNow(48) };
    expect(allowedActions(held, "supplier", now)).toEqual(["confirm", "decline", "cancel"]);
    expect(allowedActions(held, "gardener", now)).toEqual(["cancel"]);
  });

  it("waits for the payment before the supplier can accept", () => {
    expect(blockedReason({ status: "held", payment_state: "awaiting", pickup_by: null }, "confirm", "supplier", now)).toMatch(/not paid/);
    expect(blockedReason({ status: "held", payment_state: "paid", pickup_by: null }, "confirm", "supplier", now)).toBeNull();
  });

  it("allows a no-show only after the pickup time", () => {
    expect(blockedReason({ status: "confirmed", payment_state: "authorised", pickup_by: hoursFromNow(1) }, "no_show", "supplier", now)).toMatch(/pickup time/);
    expect(blockedReason({ status: "confirmed", payment_state: "authorised", pickup_by: hoursFromNow(-1) }, "no_show", "supplier", now)).toBeNull();
  });

  it("calls a gardener's cancellation timely before confirmation or 24 h ahead, a supplier's always", () => {
    expect(cancellationIsTimely({ status: "held", pickup_at: hoursFromNow(1), pickup_by: null }, "gardener", now)).toBe(true);
    expect(cancellationIsTimely({ status: "confirmed", pickup_at: hoursFromNow(25), pickup_by: null }, "gardener", now)).toBe(true);
    expect(cancellationIsTimely({ status: "confirmed", pickup_at: hoursFromNow(23), pickup_by: null }, "gardener", now)).toBe(false);
    expect(cancellationIsTimely({ status: "confirmed", pickup_at: hoursFromNow(1), pickup_by: null }, "supplier", now)).toBe(true);
  });

  it("reads the hold length from HOLD_MINUTES, defaulting to 30", () => {
    expect(holdMinutes({})).toBe(30);
    expect(holdMinutes({ HOLD_MINUTES: "5" })).toBe(5);
    expect(holdMinutes({ HOLD_MINUTES: "nonsense" })).toBe(30);
  });
});

describe("labels and money", () => {
  it("names quantities in their unit", () => {
    expect(quantityLabel(1, "bales")).toBe("1 bale");
    expect(quantityLabel(3, "bales")).toBe("3 bales");
    expect(quantityLabel(0.5, "kg")).toBe("0.5 kg");
    expect(quantityLabel(1.5, "m3")).toBe("1.5 m³");
  });
  it("prices fractional quantities in whole cents", () => {
    expect(priceFor(3200, 0.5)).toBe(1600);
    expect(priceFor(450, 3)).toBe(1350);
    expect(priceFor(333, 0.25)).toBe(83);
  });
  it("says what happens to the money", () => {
    const paid = { amount_cents: 1350, deposit_cents: 0, currency: "eur", payment_state: "paid" };
    expect(moneySentence(paid, "returned")).toContain("€13.50 is refunded in full");
    const deposit = { amount_cents: 0, deposit_cents: 200, currency: "eur", payment_state: "authorised" };
    expect(moneySentence(deposit, "kept")).toContain("€2.00 deposit is kept");
    expect(moneySentence({ ...deposit, payment_state: "awaiting" }, "returned")).toContain("Nothing was paid");
    expect(moneySentence({ amount_cents: 0, deposit_cents: 0, currency: "eur", payment_state: "none" }, "returned")).toBeNull();
  });
});

describe("answer windows and holds", () => {
  const at = new Date("2026-12-01T12:00:00Z");
  const h = (n: number) => new Date(at.getTime() + n * 3_600_000);

  it("gives the supplier 48 hours, cut short at the pickup's start", () => {
    expect(answerDeadline(at, null)).toEqual(h(SUPPLIER_REPLY_HOURS));
    expect(answerDeadline(at, h(72))).toEqual(h(48));
    expect(answerDeadline(at, h(10))).toEqual(h(10));
    expect(answerDeadline(at, h(10).toISOString())).toEqual(h(10));
    // Never before it was asked, whatever the pickup says.
    expect(answerDeadline(at, h(-2))).toEqual(at);
  });

  it("reminds half-way through the window", () => {
    expect(answerReminderAt(at, h(48))).toEqual(h(24));
    expect(answerReminderAt(at, h(10))).toEqual(h(5));
  });

  it("keeps the checkout's hold short and waits for an answer only where one is needed", () => {
    expect(holdWaitFor({ owes: true, autoAccept: false })).toBe("checkout");
    expect(holdWaitFor({ owes: true, autoAccept: true })).toBe("checkout");
    expect(holdWaitFor({ owes: false, autoAccept: false })).toBe("answer");
    expect(holdWaitFor({ owes: false, autoAccept: true })).toBeNull();
    expect(holdFor("checkout", at, h(10), 30)).toEqual({ hold_expires_at: new Date(at.getTime() + 30 * 60_000).toISOString(), answer_remind_at: null });
    expect(holdFor("answer", at, h(10))).toEqual({ hold_expires_at: h(10).toISOString(), answer_remind_at: h(5).toISOString() });
  });

  it("asks for a pickup late enough to pay and answer first", () => {
    expect(earliestPickupStart(at, { owes: false, autoAccept: true })).toBeNull();
    expect(earliestPickupStart(at, { owes: false, autoAccept: false })).toEqual(new Date(at.getTime() + MIN_ANSWER_MINUTES * 60_000));
    expect(earliestPickupStart(at, { owes: true, autoAccept: false }, 30)).toEqual(new Date(at.getTime() + (30 + MIN_ANSWER_MINUTES) * 60_000));
  });
});
