import { afterEach, describe, expect, it } from "vitest";
import { isCalendarDate, timeline } from "@/lib/calc/timeline";

const days = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / 86_400_000;
const pairs = (events: ReturnType<typeof timeline>) => events.map((e) => `${e.key} ${e.date}`);

describe("timeline", () => {
  it("lays out the first year of a northern bed built on 1 March 2026", () => {
    // By hand: checks on days 3, 7, 14, 21; worms on day 10; months 3, 6 and 12 on the 1st;
    // clippings on 15 June and leaves on 15 October, both inside the year.
    expect(pairs(timeline("2026-03-01", 51.5, { worms: true }))).toEqual([
      "build 2026-03-01",
      "moisture_check 2026-03-04",
      "moisture_check 2026-03-08",
      "add_worms 2026-03-11",
      "moisture_check 2026-03-15",
      "moisture_check 2026-03-22",
      "settling_check 2026-06-01",
      "top_up 2026-06-15",
      "check_6_months 2026-09-01",
      "top_up 2026-10-15",
      "ready 2027-03-01",
    ]);
  });

  it("moves the top-ups six months for a southern bed", () => {
    const topUps = timeline("2026-03-01", -37.8, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => [e.date, e.title])).toEqual([
      ["2026-04-15", expect.stringMatching(/leaves/i)],
      ["2026-12-15", expect.stringMatching(/clippings/i)],
    ]);
  });

  it("takes the north when the latitude is unknown", () => {
    expect(pairs(timeline("2026-03-01", null, { worms: true }))).toEqual(pairs(timeline("2026-03-01", 10, { worms: true })));
  });

  it("leaves the worms out when there are none", () => {
    expect(timeline("2026-03-01", 50, { worms: false }).some((e) => e.key === "add_worms")).toBe(false);
  });

  it("adds worms 1–2 weeks after building and calls the bed ready within 6–12 months (common practice)", () => {
    const t = timeline("2025-09-20", 45, { worms: true });
    const build = t.find((e) => e.key === "build")!.date;
    const worms = days(build, t.find((e) => e.key === "add_worms")!.date);
    expect(worms).toBeGreaterThanOrEqual(7);
    expect(worms).toBeLessThanOrEqual(14);
    const ready = days(build, t.find((e) => e.key === "ready")!.date);
    expect(ready).toBeGreaterThanOrEqual(182);
    expect(ready).toBeLessThanOrEqual(366);
    expect(days(build, t.find((e) => e.key === "check_6_months")!.date)).toBeGreaterThanOrEqual(181);
  });

  it("clamps month arithmetic to the end of shorter months", () => {
    const t = timeline("2024-08-31", 50, { worms: false });
    expect(t.find((e) => e.key === "settling_check")!.date).toBe("2024-11-30");
    expect(t.find((e) => e.key === "check_6_months")!.date).toBe("2025-02-28");
    expect(t.find((e) => e.key === "ready")!.date).toBe("2025-08-31");
    expect(timeline("2024-02-29", 50, { worms: false }).find((e) => e.key === "ready")!.date).toBe("2025-02-28");
  });

  it("skips a top-up that would fall within a month of building or after the year", () => {
    // Built 1 Oct: 15 Oct is too soon and next October is past the ready date.
    const topUps = timeline("2026-10-01", 50, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => e.date)).toEqual(["2027-06-15"]);
  });

  it("crosses the year end", () => {
    const topUps = timeline("2026-12-20", -33.9, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => e.date)).toEqual(["2027-04-15", "2027-12-15"]);
  });

  it("is sorted by date and every date is a calendar date", () => {
    for (const start of ["2026-01-31", "2026-06-15", "2027-11-30"]) {
      const t = timeline(start, 40, { worms: true });
      const dates = t.map((e) => e.date);
      expect([...dates].sort()).toEqual(dates);
      expect(dates.every(isCalendarDate)).toBe(true);
      expect(t.every((e) => e.title.length > 0)).toBe(true);
    }
  });

  it("rejects a date that is not on the calendar", () => {
    expect(() => timeline("2023-02-29", 0, { worms: true })).toThrow(RangeError);
    expect(() => timeline("1 March 2026", 0, { worms: true })).toThrow(RangeError);
  });
});

describe("timeline across time zones", () => {
  const original = process.env.TZ;
  afterEach(() => {
    process.env.TZ = original;
  });
  it.each(["Pacific/Kiritimati", "America/Adak", "UTC"])("gives the same dates in %s", (tz) => {
    process.env.TZ = tz;
    expect(pairs(timeline("2026-03-01", 51.5, { worms: true }))[0]).toBe("build 2026-03-01");
    expect(pairs(timeline("2026-03-29", 51.5, { worms: true })).at(-1)).toBe("ready 2027-03-29");
  });
});

describe("isCalendarDate", () => {
  it.each([
    ["2024-02-29", true],
    ["2023-02-29", false],
    ["2026-13-01", false],
    ["2026-04-31", false],
    ["2026-4-1", false],
    ["", false],
  ])("%s → %s", (s, ok) => {
    expect(isCalendarDate(s)).toBe(ok);
  });
});
