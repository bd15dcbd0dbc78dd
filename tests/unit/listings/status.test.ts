import { describe, expect, it } from "vitest";
import { actionsFor, effectiveStatus, planStatusChange, quantityLeft } from "@/lib/listings/status";
import type { ListingStatus } from "@/db/types";
import type { ListingAction } from "@/lib/validation/listings";

const ctx = { left: 5, held: 0, ended: false };

describe("the listing status machine", () => {
  // [from, action, to or null for refused]
  const TABLE: [ListingStatus, ListingAction, ListingStatus | null][] = [
    ["draft", "publish", "active"],
    ["draft", "pause", null],
    ["draft", "resume", null],
    ["draft", "archive", "archived"],
    ["active", "pause", "paused"],
    ["active", "publish", "active"],
    ["active", "resume", "active"],
    ["active", "archive", "archived"],
    ["paused", "resume", "active"],
    ["paused", "pause", "paused"],
    ["paused", "publish", null],
    ["paused", "archive", "archived"],
    ["gone", "pause", "paused"],
    ["gone", "archive", "archived"],
    ["expired", "resume", "active"],
    ["expired", "pause", null],
    ["archived", "resume", null],
    ["archived", "publish", null],
    ["archived", "archive", "archived"],
    ["hidden", "resume", null],
    ["hidden", "archive", null],
  ];
  for (const [from, action, to] of TABLE) {
    it(`${from} + ${action} → ${to ?? "refused"}`, () => {
      const plan = planStatusChange(from, action, ctx);
      if (to === null) expect(plan.ok).toBe(false);
      else expect(plan).toMatchObject({ ok: true, to });
    });
  }
  it("publishing or resuming with nothing left lands on gone", () => {
    expect(planStatusChange("draft", "publish", { ...ctx, left: 0 })).toMatchObject({ ok: true, to: "gone" });
    expect(planStatusChange("paused", "resume", { ...ctx, left: 0 })).toMatchObject({ ok: true, to: "gone" });
  });
  it("refuses to resume or publish past the end date, and to archive with holds", () => {
    expect(planStatusChange("expired", "resume", { ...ctx, ended: true }).ok).toBe(false);
    expect(planStatusChange("draft", "publish", { ...ctx, ended: true }).ok).toBe(false);
    expect(planStatusChange("active", "archive", { ...ctx, held: 1 }).ok).toBe(false);
  });
  it("offers only the actions the machine allows", () => {
    for (const s of ["draft", "active", "paused", "gone", "expired", "archived", "hidden"] as ListingStatus[]) {
      for (const a of actionsFor(s)) expect(planStatusChange(s, a, ctx).ok, `${s} ${a}`).toBe(true);
    }
    expect(actionsFor("archived")).toEqual([]);
  });
  it("reads a listing past its end date as expired", () => {
    const now = new Date("2027-01-02T00:00:00Z");
    expect(effectiveStatus("active", "2027-01-01T23:59:59.999Z", now)).toBe("expired");
    expect(effectiveStatus("active", "2027-01-02T00:00:01Z", now)).toBe("active");
    expect(effectiveStatus("draft", "2020-01-01T00:00:00Z", now)).toBe("draft");
    expect(effectiveStatus("active", null, now)).toBe("active");
  });
  it("never reports a negative quantity left, and no float noise", () => {
    expect(quantityLeft({ quantity_total: 14, quantity_held: 3.3, quantity_collected: 0.7 })).toBe(10);
    expect(quantityLeft({ quantity_total: 1, quantity_held: 1, quantity_collected: 0.5 })).toBe(0);
  });
});
