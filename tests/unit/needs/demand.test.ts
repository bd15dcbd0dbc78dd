// The aggregates others may see: cells hidden below three people, rings counted between
// cell centres with the asker's own needs left out, sums only from three people up, counts
// rounded from ten, and the giveaway-day suggestion built from visible cells only.
import { describe, expect, it } from "vitest";
import { destination, point } from "@turf/turf";
import { demandCells, demandRings, demandSummary, MIN_PEOPLE, roundCount, roundSig, suggestGiveaway, type DemandRow } from "@/lib/needs/demand";
import { cellOf } from "@/lib/needs/grid";
import { addDays } from "@/lib/time/zoned";

const TODAY = "2026-12-03"; // a Thursday
const CENTRE = cellOf(52.205, 0.847).centre;
const at = (km: number, bearing: number, p = CENTRE) => {
  const [lng, lat] = destination(point([p.lng, p.lat]), km, bearing, { units: "kilometers" }).geometry.coordinates;
  return { lat, lng };
};
const row = (owner: string, where: { lat: number; lng: number }, over: Partial<DemandRow> = {}): DemandRow => ({
  owner_id: owner,
  material: "leaves",
  quantity: 0.5,
  unit: "m3",
  radius_km: 10,
  needed_by: "2027-03-01",
  ...where,
  ...over,
});

describe("council cells", () => {
  it("shows a cell from three different people, and hides one of two — however many needs they have", () => {
    const rows = [row("a", CENTRE), row("b", CENTRE), row("c", CENTRE), row("d", at(3, 90)), row("d", at(3, 90)), row("e", at(3, 90)), row("e", at(3, 90))];
    const cells = demandCells(rows, "leaves");
    expect(cells).toHaveLength(1);
    expect(cells[0]).toMatchObject({ people: 3, needs: 3, quantity: 1.5, unit: "m3" });
    expect(cells[0].cell.id).toBe(cellOf(CENTRE.lat, CENTRE.lng).id);
    expect(demandSummary(rows, ["leaves", "compost"])).toEqual([
      { material: "leaves", cells: 1, people: 3 },
      { material: "compost", cells: 0, people: 0 },
    ]);
  });

  it("counts one person's many needs as one person", () => {
    const rows = [row("a", CENTRE), row("a", CENTRE), row("a", CENTRE), row("b", CENTRE)];
    expect(demandCells(rows, "leaves")).toEqual([]);
  });

  it("adds quantities given in other units in the material's own (kg of leaves as spread m³)", () => {
    const rows = [row("a", CENTRE), row("b", CENTRE), row("c", CENTRE, { quantity: 0, unit: "kg" })];
    expect(demandCells(rows, "leaves")[0].quantity).toBe(1);
  });

  it(`needs MIN_PEOPLE = 3 (a product choice) for every figure`, () => {
    expect(MIN_PEOPLE).toBe(3);
  });
});

describe("a supplier's rings", () => {
  const rows = [
    row("a", at(2, 0)),
    row("b", at(4, 90), { radius_km: 5 }),
    row("c", at(8, 180), { radius_km: 10 }),
    row("d", at(8, 270), { radius_km: 5 }), // 8 km away, but it only reaches 5
    row("e", at(20, 45), { radius_km: 25 }),
    row("me", at(1, 0)), // the asker's own need
    row("f", at(1, 10), { material: "compost" }),
  ];
  it("counts needs within each ring that also reach the point, leaving out the asker's own", () => {
    const rings = demandRings(rows, CENTRE, "leaves", "me");
    expect(rings.map((r) => [r.radius_km, r.needs, r.people])).toEqual([
      [5, 2, 2],
      [10, 3, 3],
      [25, 4, 4],
    ]);
  });
  it("gives a sum only where three or more people make it up", () => {
    const rings = demandRings(rows, CENTRE, "leaves", "me");
    expect(rings[0].quantity).toBeNull();
    expect(rings[1].quantity).toBe(1.5);
    expect(rings[2].quantity).toBe(2);
  });
  it("measures between cell centres, so moving the point inside its cell changes nothing", () => {
    const c = cellOf(CENTRE.lat, CENTRE.lng);
    const near = { lat: c.south + 0.0001, lng: c.west + 0.0001 };
    expect(demandRings(rows, near, "leaves", "me")).toEqual(demandRings(rows, CENTRE, "leaves", "me"));
  });
});

describe("rounding", () => {
  it("rounds sums to two significant figures", () => {
    expect(roundSig(1.2345)).toBe(1.2);
    expect(roundSig(0.04567)).toBe(0.046);
    expect(roundSig(1234)).toBe(1200);
    expect(roundSig(0)).toBe(0);
  });
  it("keeps counts under ten exact and rounds the rest to five", () => {
    expect([0, 1, 9, 10, 12, 13, 47].map(roundCount)).toEqual([0, 1, 9, 10, 10, 15, 45]);
  });
});

describe("the giveaway-day suggestion", () => {
  const people = (n: number, where: { lat: number; lng: number }, dates: string[], prefix: string) =>
    Array.from({ length: n }, (_, i) => row(`${prefix}${i}`, where, { needed_by: dates[i % dates.length] }));

  it("picks the busiest cell and its neighbours, a Saturday before most of their dates, and the slots they fill", () => {
    const rows = [
      ...people(12, CENTRE, ["2027-03-01", "2027-03-15", "2027-04-01"], "a"),
      ...people(5, at(1.5, 90), ["2027-03-20"], "b"),
      ...people(2, at(1.5, 0), ["2027-03-20"], "hidden"), // below the threshold: not counted
      ...people(9, at(12, 0), ["2027-03-20"], "far"), // beyond the catchment
    ];
    const s = suggestGiveaway(rows, "leaves", TODAY)!;
    expect(s).toMatchObject({ date: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/) });
    expect(new Date(`${s.date}T12:00:00Z`).getUTCDay()).toBe(6);
    // 17 households; the latest Saturday that still comes before three quarters of their dates.
    expect(s.date).toBe("2027-03-13");
    expect(s.households).toBe(13); // the four due on 1 March are past by then
    expect(s.slots).toBe(2); // ten households a slot
    expect(s.quantity).toBe(6.5);
    // Between the two cells, weighted by people: nobody's home.
    expect(s.place.lat).toBeCloseTo(CENTRE.lat, 2);
    expect(s.place.lng).toBeGreaterThan(CENTRE.lng);
  });

  it("gives the council a fortnight's notice at least", () => {
    // Three need it within days (too soon to organise), three in two months.
    const rows = people(6, CENTRE, [addDays(TODAY, 3), addDays(TODAY, 60)], "a");
    const s = suggestGiveaway(rows, "leaves", TODAY)!;
    expect(s.date >= addDays(TODAY, 14)).toBe(true);
    expect(s.date <= addDays(TODAY, 60)).toBe(true);
    expect(s.households).toBe(3);
  });

  it("suggests nothing when fewer than three households would be served", () => {
    expect(suggestGiveaway(people(2, CENTRE, ["2027-03-01"], "a"), "leaves", TODAY)).toBeNull();
    // Three in the cell, but two of them need it before any day could be held.
    expect(suggestGiveaway(people(3, CENTRE, [addDays(TODAY, 2), addDays(TODAY, 5), "2027-03-01"], "a"), "leaves", TODAY)).toBeNull();
  });
});
