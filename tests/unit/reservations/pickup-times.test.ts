import { describe, expect, it } from "vitest";
import { formatLocal, nextOccurrence, windowLabel, zonedTime } from "@/lib/reservations/pickup-times";
import { newPickupCode, normalisePickupCode, pickupCodeMatches } from "@/lib/reservations/pickup-code";

const weekly = (weekday: number, start: string, end: string) => ({ id: "w", kind: "weekly" as const, weekday, start_time: start, end_time: end, starts_at: null, ends_at: null });

describe("local pickup times", () => {
  // UK clocks: GMT (UTC+0) in winter, BST (UTC+1) from the last Sunday of March
  // (gov.uk/when-do-the-clocks-change: 29 March – 25 October 2026).
  it("turns London wall-clock time into UTC in winter and in summer", () => {
    expect(zonedTime(2026, 12, 5, "09:00", "Europe/London").toISOString()).toBe("2026-12-05T09:00:00.000Z");
    expect(zonedTime(2026, 7, 4, "09:00", "Europe/London").toISOString()).toBe("2026-07-04T08:00:00.000Z");
    // Central European Time is UTC+1 in winter.
    expect(zonedTime(2026, 12, 5, "09:00", "Europe/Berlin").toISOString()).toBe("2026-12-05T08:00:00.000Z");
  });

  it("finds the next Saturday morning window, or today's while it is still open", () => {
    const w = weekly(6, "09:00", "12:00");
    // Tuesday 1 Dec 2026 → Saturday 5 Dec.
    expect(nextOccurrence(w, new Date("2026-12-01T10:00:00Z"), "Europe/London")).toEqual({ start: new Date("2026-12-05T09:00:00Z"), end: new Date("2026-12-05T12:00:00Z") });
    // Saturday 5 Dec at 11:00: still open, so today.
    expect(nextOccurrence(w, new Date("2026-12-05T11:00:00Z"), "Europe/London")!.start.toISOString()).toBe("2026-12-05T09:00:00.000Z");
    // Saturday after closing: next week.
    expect(nextOccurrence(w, new Date("2026-12-05T12:30:00Z"), "Europe/London")!.start.toISOString()).toBe("2026-12-12T09:00:00.000Z");
  });

  it("crosses the change to summer time on the right local hour", () => {
    // Sunday 29 March 2026 is the change; the Monday after is on BST.
    const w = weekly(1, "17:00", "19:00");
    expect(nextOccurrence(w, new Date("2026-03-28T12:00:00Z"), "Europe/London")!.start.toISOString()).toBe("2026-03-30T16:00:00.000Z");
  });

  it("takes a dated window while it has not ended", () => {
    const d = { id: "d", kind: "dated" as const, weekday: null, start_time: null, end_time: null, starts_at: "2026-12-12T09:00:00Z", ends_at: "2026-12-12T13:00:00Z" };
    expect(nextOccurrence(d, new Date("2026-12-12T12:00:00Z"), "Europe/London")).toEqual({ start: new Date("2026-12-12T09:00:00Z"), end: new Date("2026-12-12T13:00:00Z") });
    expect(nextOccurrence(d, new Date("2026-12-12T13:00:01Z"), "Europe/London")).toBeNull();
  });

  it("reads a dated window's time as the local wall clock (stored in UTC digits), BST included", () => {
    // "Sat 4 July 2026, 10:00–13:00" as the supplier typed it is 09:00–12:00 UTC on British Summer Time.
    const d = { id: "d", kind: "dated" as const, weekday: null, start_time: null, end_time: null, starts_at: "2026-07-04T10:00:00Z", ends_at: "2026-07-04T13:00:00Z" };
    const occ = nextOccurrence(d, new Date("2026-07-01T00:00:00Z"), "Europe/London")!;
    expect([occ.start.toISOString(), occ.end.toISOString()]).toEqual(["2026-07-04T09:00:00.000Z", "2026-07-04T12:00:00.000Z"]);
  });

  it("labels windows in the town's words", () => {
    expect(windowLabel(weekly(6, "09:00", "12:00"))).toBe("Saturdays 09:00–12:00");
    expect(formatLocal("2026-12-05T09:00:00Z", "Europe/London")).toBe("Sat 5 Dec, 09:00");
  });
});

describe("pickup codes", () => {
  it("are six characters without look-alikes", () => {
    for (let i = 0; i < 200; i++) expect(newPickupCode()).toMatch(/^[A-HJKMNP-Z2-9]{6}$/);
  });
  it("match regardless of case, spaces and dashes, and not otherwise", () => {
    expect(normalisePickupCode(" k7m-2qx ")).toBe("K7M2QX");
    expect(pickupCodeMatches("K7M2QX", "k7m 2qx")).toBe(true);
    expect(pickupCodeMatches("K7M2QX", "K7M2QY")).toBe(false);
    expect(pickupCodeMatches("K7M2QX", "K7M2Q")).toBe(false);
  });
});

describe("openings late enough to answer first", () => {
  const w = { id: "w", kind: "weekly" as const, weekday: 6, start_time: "09:00", end_time: "12:00", starts_at: null, ends_at: null };
  it("skips to next week's opening when this week's starts too soon", () => {
    const now = new Date("2026-12-05T08:30:00Z"); // Saturday 08:30 in London
    expect(nextOccurrence(w, now, "Europe/London")!.start.toISOString()).toBe("2026-12-05T09:00:00.000Z");
    expect(nextOccurrence(w, now, "Europe/London", new Date("2026-12-05T09:30:00Z"))!.start.toISOString()).toBe("2026-12-12T09:00:00.000Z");
    // An opening already under way is not offered to a request that must wait for an answer.
    expect(nextOccurrence(w, new Date("2026-12-05T10:00:00Z"), "Europe/London", new Date("2026-12-05T11:00:00Z"))!.start.toISOString()).toBe("2026-12-12T09:00:00.000Z");
  });
  it("has no later opening for a dated window that starts too soon", () => {
    const d = { id: "d", kind: "dated" as const, weekday: null, start_time: null, end_time: null, starts_at: "2026-12-12T10:00:00.000Z", ends_at: "2026-12-12T12:00:00.000Z" };
    expect(nextOccurrence(d, new Date("2026-12-12T09:30:00Z"), "Europe/London", new Date("2026-12-12T10:30:00Z"))).toBeNull();
    expect(nextOccurrence(d, new Date("2026-12-12T08:00:00Z"), "Europe/London", new Date("2026-12-12T09:00:00Z"))).toEqual({ start: new Date("2026-12-12T10:00:00.000Z"), end: new Date("2026-12-12T12:00:00.000Z") });
  });
});
