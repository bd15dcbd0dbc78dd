import { afterEach, describe, expect, it } from "vitest";
import { bedMilestones, bedStage, isCalendarDate, timeline } from "@/lib/calc/timeline";

const days = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / 86_400_000;
const pairs = (events: ReturnType<typeof timeline>) => events.map((e) => `${e.key} ${e.date}`);

describe("timeline", () => {
  it("lays out the first year of a northern bed built on 1 March 2026, and its next top-ups", () => {
    // By hand: checks on days 3, 7, 14, 21; worms on day 10; months 3, 6 and 12 on the 1st;
    // clippings on 15 June and leaves on 15 October inside the year (north: leaves in
    // October–November, clippings in June–July, common practice), then the first of each
    // after the ready date, 15 June and 15 October 2027.
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
      "plant_into 2026-09-01",
      "top_up 2026-10-15",
      "ready 2027-03-01",
      "top_up 2027-06-15",
      "top_up 2027-10-15",
    ]);
  });

  it("moves the top-ups six months for a southern bed", () => {
    // South: leaves in April–May, clippings in December–January (common practice). Built
    // 1 March 2026, ready 1 March 2027: leaves 15 Apr 2026, clippings 15 Dec 2026, then the
    // first of each after the ready date, 15 Apr 2027 and 15 Dec 2027.
    const topUps = timeline("2026-03-01", -37.8, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => [e.date, e.title])).toEqual([
      ["2026-04-15", expect.stringMatching(/leaves/i)],
      ["2026-12-15", expect.stringMatching(/clippings/i)],
      ["2027-04-15", expect.stringMatching(/leaves/i)],
      ["2027-12-15", expect.stringMatching(/clippings/i)],
    ]);
  });

  it("gives a northern bed built on 1 October its autumn leaves after it is ready", () => {
    // Built 1 Oct 2026, ready 1 Oct 2027. 15 Oct 2026 is within a month of building, so the
    // first leaves fall on 15 Oct 2027, after the ready date; clippings on 15 June 2027 and,
    // the first after ready, 15 June 2028.
    const t = timeline("2026-10-01", 50, { worms: false });
    expect(t.filter((e) => e.key === "top_up").map((e) => [e.date, e.title])).toEqual([
      ["2027-06-15", expect.stringMatching(/clippings/i)],
      ["2027-10-15", expect.stringMatching(/leaves/i)],
      ["2028-06-15", expect.stringMatching(/clippings/i)],
    ]);
    expect(pairs(t).slice(-4)).toEqual(["top_up 2027-06-15", "ready 2027-10-01", "top_up 2027-10-15", "top_up 2028-06-15"]);
  });

  it("gives a southern bed built on 1 April its autumn leaves after it is ready", () => {
    // Built 1 Apr 2026 at 33.9° S, ready 1 Apr 2027. 15 Apr 2026 is within a month of
    // building; leaves on 15 Apr 2027, after ready; clippings 15 Dec 2026, then 15 Dec 2027.
    const topUps = timeline("2026-04-01", -33.9, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => e.date)).toEqual(["2026-12-15", "2027-04-15", "2027-12-15"]);
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

  it("tells planting into it (6–9 months, Oregon State Extension) apart from most of it being soil (about a year)", () => {
    const t = timeline("2026-03-01", 51.5, { worms: false });
    const plant = t.find((e) => e.key === "plant_into")!;
    const soil = t.find((e) => e.key === "ready")!;
    expect(plant.date).toBe("2026-09-01");
    expect(plant.title).toBe("You can plant into it");
    expect(plant.detail).toMatch(/Oregon State Extension/);
    expect(plant.detail).toMatch(/month 9/);
    expect(soil.date).toBe("2027-03-01");
    expect(soil.title).toBe("Most of it has turned to soil");
    expect(soil.title).not.toMatch(/ready to plant/i);
  });

  it("clamps month arithmetic to the end of shorter months", () => {
    const t = timeline("2024-08-31", 50, { worms: false });
    expect(t.find((e) => e.key === "settling_check")!.date).toBe("2024-11-30");
    expect(t.find((e) => e.key === "check_6_months")!.date).toBe("2025-02-28");
    expect(t.find((e) => e.key === "ready")!.date).toBe("2025-08-31");
    expect(timeline("2024-02-29", 50, { worms: false }).find((e) => e.key === "ready")!.date).toBe("2025-02-28");
  });

  it("skips a top-up within a month of building", () => {
    // Built 20 Sep 2026, ready 20 Sep 2027: 15 Oct 2026 is 25 days on, too soon, so the
    // leaves wait for 15 Oct 2027; clippings 15 June 2027 and, after ready, 15 June 2028.
    const topUps = timeline("2026-09-20", 50, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => e.date)).toEqual(["2027-06-15", "2027-10-15", "2028-06-15"]);
  });

  it("crosses the year end", () => {
    // Built 20 Dec 2026 at 33.9° S, ready 20 Dec 2027: 15 Dec 2027 falls before ready, so the
    // clippings come again on 15 Dec 2028; the leaves on 15 Apr 2027 and 15 Apr 2028.
    const topUps = timeline("2026-12-20", -33.9, { worms: false }).filter((e) => e.key === "top_up");
    expect(topUps.map((e) => e.date)).toEqual(["2027-04-15", "2027-12-15", "2028-04-15", "2028-12-15"]);
  });

  it("ends with one top-up of each kind after the ready date, whatever the start", () => {
    for (const [start, lat] of [["2026-01-31", 40], ["2026-06-15", -20], ["2027-11-30", 60], ["2024-02-29", -45]] as const) {
      const t = timeline(start, lat, { worms: true });
      const ready = t.find((e) => e.key === "ready")!.date;
      const after = t.filter((e) => e.date >= ready && e.key === "top_up");
      expect(after.map((e) => /leaves/i.test(e.title)).sort()).toEqual([false, true]);
      // Each falls within a year of ready, and nothing but top-ups comes after it.
      for (const e of after) expect(days(ready, e.date)).toBeLessThan(366);
      expect(t.filter((e) => e.date > ready).every((e) => e.key === "top_up")).toBe(true);
    }
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
    expect(pairs(timeline("2026-03-29", 51.5, { worms: true }))).toContain("ready 2027-03-29");
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

describe("amounts for this bed", () => {
  // A 3 × 1.2 m bed built 17.5 cm deep (12.5 cm of leaves and 5 cm of straw).
  const bed = { area_m2: 3.6, built_depth_cm: 17.5 };
  const t = timeline("2026-03-01", 51.5, { worms: true, bed });

  it("says how deep it should have sunk to at 3, 6 and 12 months (60 %, 50 %, 40 %: common practice, no source)", () => {
    // 17.5 × 0.6 = 10.5; × 0.5 = 8.75, given to the millimetre; × 0.4 = 7.
    expect(t.find((e) => e.key === "settling_check")!.settled_depth_cm).toBe(10.5);
    expect(t.find((e) => e.key === "check_6_months")!.settled_depth_cm).toBe(8.8);
    expect(t.find((e) => e.key === "ready")!.settled_depth_cm).toBe(7);
    expect(t.find((e) => e.key === "settling_check")!.detail).toMatch(/about 10\.5 cm of the 17\.5 cm you built \(common practice\)/);
  });

  it("gives each top-up its volume and bags (5 cm of leaves, 2 cm of clippings: common practice)", () => {
    // Leaves: 3.6 m² × 0.05 m = 0.18 m³ = 1.6 bags of 30 US gal (0.1136 m³) → 2 bags.
    // Clippings: 3.6 × 0.02 = 0.072 m³ → 1 bag.
    const leaves = t.find((e) => e.key === "top_up" && e.top_up?.material === "leaves")!;
    const clippings = t.find((e) => e.key === "top_up" && e.top_up?.material === "grass_clippings")!;
    expect(leaves.top_up).toEqual({ material: "leaves", depth_cm: 5, m3: 0.18, bags: 2 });
    expect(clippings.top_up).toEqual({ material: "grass_clippings", depth_cm: 2, m3: 0.072, bags: 1 });
    expect(leaves.detail).toMatch(/5 cm of leaves: 0\.18 m³, about 2 bags for this bed/);
  });

  it("writes the amounts in the units asked for", () => {
    const imperial = timeline("2026-03-01", 51.5, { worms: true, bed, units: "imperial" });
    // 10.5 cm = 4.1 in, 17.5 cm = 6.9 in; 0.18 m³ = 6.36 ft³ (NIST HB44).
    expect(imperial.find((e) => e.key === "settling_check")!.detail).toMatch(/about 4\.1 in of the 6\.9 in/);
    expect(imperial.find((e) => e.top_up?.material === "leaves")!.detail).toMatch(/6\.36 ft³/);
  });

  it("leaves the amounts out when it does not know the bed", () => {
    const plain = timeline("2026-03-01", 51.5, { worms: true });
    expect(plain.some((e) => e.settled_depth_cm !== undefined || e.top_up !== undefined)).toBe(false);
  });
});

describe("which stage a bed is at", () => {
  const m = bedMilestones("2026-03-01");
  it("dates planting into it from month 6 to month 9, and soil by month 12", () => {
    expect(m).toEqual({ build: "2026-03-01", plant_into_from: "2026-09-01", plant_into_until: "2026-12-01", soil_by: "2027-03-01" });
  });
  it.each([
    ["2026-02-28", "not_built"],
    ["2026-03-01", "settling"],
    ["2026-08-31", "settling"],
    ["2026-09-01", "plant_into"],
    ["2027-02-28", "plant_into"],
    ["2027-03-01", "soil"],
  ])("on %s it is %s", (today, stage) => {
    expect(bedStage(m, today)).toBe(stage);
  });
});
