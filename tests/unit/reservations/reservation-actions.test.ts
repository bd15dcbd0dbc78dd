// The shared action buttons read "Cancel order" on a posted live-culture order, and keep
// "Cancel reservation" for everything collected (the e2e journeys click that label).
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";

// The buttons ask for the app router, which only exists inside Next.js.
vi.mock("next/navigation", () => ({
  useRouter: () => ({ refresh() {}, push() {}, replace() {}, back() {}, forward() {}, prefetch() {} }),
}));
const { ReservationActions } = await import("@/components/reservations/reservation-actions");

const render = (props: Partial<Parameters<typeof ReservationActions>[0]>) =>
  renderToStaticMarkup(createElement(ReservationActions, { id: "r1", side: "gardener", actions: ["cancel"], canPay: false, cancelNote: "", ...props }));

describe("the cancel button", () => {
  it("reads Cancel order on a posted culture order, for either side", () => {
    for (const side of ["gardener", "supplier"] as const) {
      const html = render({ side, posted: true });
      expect(html).toContain("Cancel order");
      expect(html).not.toContain("Cancel reservation");
    }
  });

  it("reads Cancel reservation on anything collected", () => {
    for (const posted of [false, undefined]) {
      const html = render({ posted });
      expect(html).toContain("Cancel reservation");
      expect(html).not.toContain("Cancel order");
    }
  });

  it("is not shown where cancelling is not allowed", () => {
    expect(render({ posted: true, actions: ["confirm"], side: "supplier" })).not.toMatch(/Cancel (order|reservation)/);
  });
});

describe("what the cancel button says happens to the money", () => {
  // lib/reservations/policy.ts: a posted culture can be cancelled only before it is packed,
  // and then everything is returned; a pickup keeps the CANCEL_NOTICE_HOURS rule.
  it("speaks of packing, not a pickup, on a posted order", async () => {
    const { cancelNoteFor } = await import("@/components/reservations/reservation-card");
    const order = { fulfilment: "post" as const } as NonNullable<Parameters<typeof cancelNoteFor>[0]["order"]>;
    const posted = cancelNoteFor({ side: "gardener", status: "confirmed", amount_cents: 1600, order });
    expect(posted).toMatch(/before it is packed/);
    expect(posted).not.toMatch(/pickup/);
    const collected = cancelNoteFor({ side: "gardener", status: "confirmed", amount_cents: 1600, order: null });
    expect(collected).toMatch(/hours before the pickup/);
  });
});
