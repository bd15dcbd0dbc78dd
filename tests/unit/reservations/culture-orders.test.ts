import { describe, expect, it } from "vitest";
import { allowedOrderActions, cultureOptions, dayLabel, defaultFulfilment, estimatedWorms, nextPostingDay, orderBlockedReason, postingState, type OrderSubject } from "@/lib/reservations/culture-orders";

const order = (over: Partial<OrderSubject> = {}): OrderSubject => ({ status: "confirmed", fulfilment: "post", order_stage: "paid", ...over });
const open = { postingPaused: false };

describe("the next posting day", () => {
  // Calendar facts: 9 January 2026 is a Friday, 12 January a Monday, 6 July 2026 a Monday.
  it("is the first chosen weekday after today, in the town's zone", () => {
    expect(nextPostingDay([1, 2], new Date("2026-01-09T10:00:00Z"), "Europe/London")).toBe("2026-01-12");
    expect(nextPostingDay([1, 2], new Date("2026-01-12T10:00:00Z"), "Europe/London")).toBe("2026-01-13");
    expect(nextPostingDay([1], new Date("2026-01-12T10:00:00Z"), "Europe/London")).toBe("2026-01-19");
  });
  it("counts the local date, not the UTC one, around midnight", () => {
    // 23:30 UTC on Sunday 5 July is 00:30 on Monday in London (BST): the next day is Tuesday.
    expect(nextPostingDay([1, 2], new Date("2026-07-05T23:30:00Z"), "Europe/London")).toBe("2026-07-07");
    expect(nextPostingDay([1, 2], new Date("2026-07-05T23:30:00Z"), "UTC")).toBe("2026-07-06");
  });
  it("is null with no posting days, and reads as a day name", () => {
    expect(nextPostingDay([], new Date())).toBeNull();
    expect(dayLabel("2026-01-12")).toBe("Monday 12 January");
  });
});

describe("parcel steps", () => {
  it("go paid → packed → shipped → delivered, by the grower, and delivered by either side", () => {
    expect(allowedOrderActions(order(), "supplier", open)).toEqual(["pack"]);
    expect(allowedOrderActions(order({ order_stage: "packed" }), "supplier", open)).toEqual(["ship"]);
    expect(allowedOrderActions(order({ order_stage: "shipped" }), "supplier", open)).toEqual(["deliver"]);
    expect(allowedOrderActions(order({ order_stage: "shipped" }), "gardener", open)).toEqual(["deliver"]);
    expect(allowedOrderActions(order(), "gardener", open)).toEqual([]);
  });
  it("refuse the wrong side, a collected culture, a held or closed order, and shipping while paused", () => {
    expect(orderBlockedReason(order(), "pack", "gardener", open)).toBe("wrong_party");
    expect(orderBlockedReason(order({ fulfilment: "pickup" }), "pack", "supplier", open)).toMatch(/collected, not posted/);
    expect(orderBlockedReason(order({ fulfilment: null }), "pack", "supplier", open)).toMatch(/Only posted/);
    expect(orderBlockedReason(order({ status: "held", order_stage: null }), "pack", "supplier", open)).toMatch(/not confirmed/);
    expect(orderBlockedReason(order({ status: "cancelled" }), "pack", "supplier", open)).toMatch(/cancelled/);
    expect(orderBlockedReason(order({ order_stage: "packed" }), "ship", "supplier", { postingPaused: true })).toMatch(/paused/);
    expect(orderBlockedReason(order({ order_stage: "packed" }), "pack", "supplier", open)).toMatch(/packed; it cannot be packed now/);
  });
});

describe("what a culture listing offers", () => {
  it("offers both ways unless the grower switched one off, and defaults to collection", () => {
    expect(cultureOptions({ species: "Eisenia fetida" })).toEqual({ ships: true, pickup: true });
    expect(cultureOptions({ ships: false })).toEqual({ ships: false, pickup: true });
    expect(defaultFulfilment({ ships: true, pickup: true })).toBe("pickup");
    expect(defaultFulfilment({ ships: true, pickup: false })).toBe("post");
  });
  it("estimates about 1,000 worms a pound, to the hundred (common practice, no source)", () => {
    // 1 kg ÷ 0.45359237 kg/lb × 1,000 = 2,204.6 → 2,200; 0.5 kg → 1,102 → 1,100.
    expect(estimatedWorms(1)).toBe(2200);
    expect(estimatedWorms(0.5)).toBe(1100);
  });
});

describe("a posted order against the grower's posting days", () => {
  // 3 December 2026 is a Thursday, 7 December a Monday (calendar).
  const thursday = new Date("2026-12-03T11:00:00Z");
  it("warns on a day the grower does not post, and names the next posting day", () => {
    expect(postingState([1, 2], false, thursday)).toEqual({ today: false, next_day: "2026-12-07", paused: false });
  });
  it("is quiet on a posting day", () => {
    expect(postingState([4], false, thursday).today).toBe(true);
  });
  it("has no posting day while posting is paused", () => {
    expect(postingState([4], true, thursday)).toEqual({ today: false, next_day: null, paused: true });
  });
});
