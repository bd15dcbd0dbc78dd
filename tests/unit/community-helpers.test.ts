import { formatMoney } from "@/lib/format/money";
import { describe, expect, it } from "vitest";
import { toCsv } from "@/lib/format/csv";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { addDays, localDate, wallTime, zonedToUtc } from "@/lib/time/zoned";
import { bookingWindowState, cancelDeadline } from "@/lib/giveaways/view";

describe("wall-clock times in a zone", () => {
  // Europe/London: GMT (UTC+0) in winter, BST (UTC+1) from the last Sunday of March (UK
  // Summer Time Order; 2027-03-28) to the last Sunday of October.
  it("turns 09:30 local into UTC on either side of the clock change", () => {
    expect(zonedToUtc("2027-01-16", "09:30", "Europe/London").toISOString()).toBe("2027-01-16T09:30:00.000Z");
    expect(zonedToUtc("2027-06-12", "09:30", "Europe/London").toISOString()).toBe("2027-06-12T08:30:00.000Z");
    expect(zonedToUtc("2027-03-28", "12:00", "Europe/London").toISOString()).toBe("2027-03-28T11:00:00.000Z");
    // New York is UTC−5 in January (EST).
    expect(zonedToUtc("2027-01-16", "09:30", "America/New_York").toISOString()).toBe("2027-01-16T14:30:00.000Z");
  });
  it("reads back the local time and day", () => {
    expect(wallTime("2027-06-12T08:30:00.000Z", "Europe/London")).toBe("09:30");
    expect(localDate(new Date("2027-01-16T23:30:00Z"), "Europe/Berlin")).toBe("2027-01-17");
    expect(addDays("2027-02-28", 1)).toBe("2027-03-01");
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
  });
});

describe("booking rules of a day", () => {
  const day = { booking_opens_at: "2027-01-01T00:00:00.000Z", booking_closes_at: "2027-01-15T18:00:00.000Z", status: "scheduled" };
  it("is open between the two times, and closed or not yet outside them", () => {
    expect(bookingWindowState(day, new Date("2026-12-31T23:59:59Z"))).toBe("not_yet");
    expect(bookingWindowState(day, new Date("2027-01-10T12:00:00Z"))).toBe("open");
    expect(bookingWindowState(day, new Date("2027-01-15T18:00:00Z"))).toBe("closed");
    expect(bookingWindowState({ ...day, status: "cancelled" }, new Date("2027-01-10T12:00:00Z"))).toBe("cancelled");
  });
  it("lets a household cancel until the cut-off before its slot", () => {
    expect(cancelDeadline("2027-01-16T09:00:00.000Z", 12).toISOString()).toBe("2027-01-15T21:00:00.000Z");
  });
});

describe("CSV and display formats", () => {
  it("quotes what needs quoting (RFC 4180) and defuses formulas (OWASP CSV injection)", () => {
    expect(toCsv(["a", "b"], [["plain", 3], ['say "hi", then', null], ["=HYPERLINK(1)", "-5 bags"], [-5, true]])).toBe(
      'a,b\r\nplain,3\r\n"say ""hi"", then",\r\n\'=HYPERLINK(1),\'-5 bags\r\n-5,true\r\n',
    );
  });
  it("shows money and giveaway quantities", () => {
    expect(formatMoney(500, "eur")).toBe("€5.00");
    expect(formatMoney(1250, "gbp")).toBe("£12.50");
    // Nothing to pay reads as money unless the screen words it; en-GB currency format (from memory).
    expect(formatMoney(0, "eur")).toBe("€0.00");
    expect(formatMoney(0, "eur", { zero: "free" })).toBe("free");
    expect(formatMoney(5, "usd", { zero: "free" })).toBe("US$0.05");
    expect(formatGiveawayQuantity(1, "bags")).toBe("1 bag");
    expect(formatGiveawayQuantity(4, "bags")).toBe("4 bags");
    expect(formatGiveawayQuantity(0.5, "m3")).toBe("0.5 m³");
    // Three figures, never more than two decimals of a cubic metre (common practice, no source).
    expect(formatGiveawayQuantity(12.345, "m3")).toBe("12.3 m³");
    expect(formatGiveawayQuantity(0.125, "m3")).toBe("0.13 m³");
  });
});
