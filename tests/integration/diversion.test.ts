import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createListing, createReservation, createUser } from "../factories";
import * as diversion from "@/app/api/reports/diversion/route";
import * as diversionCsv from "@/app/api/reports/diversion.csv/route";
import { BAG_M3, BALE_M3 } from "@/lib/calc/facts";
import { platformDivertedKg, platformGiveawayKg } from "@/lib/services/figures/steps/platform-kilograms";
import { recordAttendance } from "@/lib/services/giveaways/record-attendance";
import { councilOf } from "@/lib/auth/council-access";
import { loadSessionUser } from "@/lib/auth/current-user";

// Unit factors, NIST Handbook 44 App. C (exact): 1 lb = 0.45359237 kg, 1 US gal = 231 in³ =
// 0.003785411784 m³, 1 ft³ = 7.480519 gal, 1 yd³ = 0.764554857984 m³.
const LB = 0.45359237;
const GAL = 0.003785411784;
const YD3 = 0.764554857984;

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p: Record<string, string> = {};
let councilDay: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  p.supplier = (await createUser({ roles: ["gardener", "supplier"] })).id;
  p.other = (await createUser({ roles: ["supplier"] })).id;
  const owner = await createUser({ roles: ["council"] });
  p.council = owner.id;
  p.councilStaff = (await createUser({ roles: ["council"], organisation_id: owner.organisation_id })).id;
  p.grower = (await createUser({ roles: ["grower"] })).id;
  const households = await Promise.all(Array.from({ length: 6 }, () => createUser({ roles: ["gardener"] })));
  const [g1, g2, g3, g4, g5, g6] = households.map((h) => h.id);
  p.gardener = g1;

  // The supplier's hand-overs.
  const leaves = await createListing({ owner_id: p.supplier, material_code: "leaves", unit: "bags", unit_size: BAG_M3, quantity_total: 40 });
  const straw = await createListing({ owner_id: p.supplier, material_code: "straw", unit: "bales", unit_size: BALE_M3, quantity_total: 20 });
  const grounds = await createListing({ owner_id: p.supplier, material_code: "coffee_grounds", unit: "kg", quantity_total: 40 });
  await createReservation({ listing_id: leaves.id, gardener_id: g1, quantity: 4, status: "collected", updated_at: "2026-10-20T10:00:00.000Z" });
  await createReservation({ listing_id: leaves.id, gardener_id: g2, quantity: 6, status: "collected", updated_at: "2026-11-03T10:00:00.000Z" });
  await createReservation({ listing_id: leaves.id, gardener_id: g3, quantity: 5, status: "held" });
  await createReservation({ listing_id: leaves.id, gardener_id: g3, quantity: 3, status: "cancelled" });
  await createReservation({ listing_id: straw.id, gardener_id: g2, quantity: 3, status: "collected", updated_at: "2026-11-10T10:00:00.000Z" });
  // Collected in November (closed_at), touched again in December: the month is November.
  await createReservation({ listing_id: grounds.id, gardener_id: g3, quantity: 12.5, status: "collected", updated_at: "2026-12-02T10:00:00.000Z", closed_at: "2026-11-12T10:00:00.000Z" });
  // Another supplier's collection counts for them and the platform, not for this supplier.
  const theirs = await createListing({ owner_id: p.other, material_code: "leaves", unit: "bags", unit_size: null, quantity_total: 10 });
  await createReservation({ listing_id: theirs.id, gardener_id: g1, quantity: 5, status: "collected", updated_at: "2026-11-05T10:00:00.000Z" });

  // The council: an organisation listing of compost, and a leaf giveaway day.
  const compost = await createListing({ owner_id: p.council, organisation_id: owner.organisation_id, material_code: "compost", unit: "m3", quantity_total: 10 });
  await createReservation({ listing_id: compost.id, gardener_id: g4, quantity: 0.5, status: "collected", updated_at: "2026-11-20T10:00:00.000Z" });
  const day = await createGiveaway(p.council, { household_cap: 6, slots: [{ start: "09:00", end: "10:00", capacity: 10 }] });
  councilDay = day.id;
  const ctxCouncil = councilOf((await loadSessionUser(p.council))!);
  for (const [user, bags, arrived] of [[g4, 4, true], [g5, 2, true], [g6, 6, true], [g1, 5, false]] as const) {
    const b = await bookAs(user, day.id, { slot_id: day.slots[0].id, quantity: bags });
    if (arrived) await recordAttendance(ctxCouncil, day.id, b.json.booking.id, "checked_in");
  }
});
afterAll(() => ctx.close());

const get = async (as: string | null, qs = "") => call(diversion.GET as never, await request(`/api/reports/diversion${qs}`, { as }));

describe("GET /api/reports/diversion", () => {
  it("sums a supplier's collected quantities through the sourced densities (hand-computed)", async () => {
    // Leaves: 30 US gal bags (common practice) × 1 lb/US gal loose leaves (Missouri S&T table):
    //   October 4 bags = 120 lb = 54.431 kg; November 6 bags = 180 lb = 81.647 kg.
    // Straw: 3 bales with no weight stated, at a small bale's usual 45 lb (inside 40–60 lb,
    //   common practice) = 135 lb = 61.235 kg.
    // Coffee grounds by weight: 12.5 kg as given.
    // The held and cancelled reservations, and the other supplier's, do not count.
    // Total 54.431 + 81.647 + 61.235 + 12.5 = 209.813 kg.
    const res = await get(p.supplier);
    expect(res.status).toBe(200);
    const leavesOct = 4 * 30 * LB;
    const leavesNov = 6 * 30 * LB;
    const straw = 3 * 45 * LB;
    expect(leavesOct).toBeCloseTo(54.431, 3);
    expect(straw).toBeCloseTo(61.235, 2);
    expect(res.json.total_kg).toBeCloseTo(leavesOct + leavesNov + straw + 12.5, 2);
    expect(res.json.total_kg).toBeCloseTo(209.813, 2);
    expect(res.json.by_month).toEqual([
      expect.objectContaining({ month: "2026-10", material: "leaves", kg: expect.closeTo(leavesOct, 3), m3: expect.closeTo(4 * 30 * GAL, 4) }),
      // 12.5 kg ÷ (7 lb/gal × 0.45359237 / 0.003785411784 = 838.79 kg/m³) = 0.0149 m³
      expect.objectContaining({ month: "2026-11", material: "coffee_grounds", kg: 12.5, m3: expect.closeTo(12.5 / ((7 * LB) / GAL), 4) }),
      expect.objectContaining({ month: "2026-11", material: "leaves", kg: expect.closeTo(leavesNov, 3), m3: expect.closeTo(6 * 30 * GAL, 4) }),
      expect.objectContaining({ month: "2026-11", material: "straw", kg: expect.closeTo(straw, 2), m3: expect.closeTo(3 * BALE_M3, 4) }),
    ]);
    expect(res.json.households).toBe(3);
    expect(res.json.densities.find((d: { material: string }) => d.material === "leaves").source).toContain("Missouri S&T");
  });

  it("gives a council its organisation's listings and checked-in households, per giveaway day too", async () => {
    // Compost 0.5 m³ × 1,300 lb/yd³ (midpoint of 1,000–1,600, recycling-measurement guidance,
    // common practice) = 0.5 × 1300 × 0.45359237 / 0.764554857984 = 385.630 kg.
    // Leaf day: 4 + 2 + 6 bags checked in = 12 × 30 gal × 1 lb/gal = 360 lb = 163.293 kg; the
    // household that booked 5 bags but was not checked in does not count.
    const compost = (0.5 * 1300 * LB) / YD3;
    const leafDay = 12 * 30 * LB;
    expect(compost).toBeCloseTo(385.63, 2);
    expect(leafDay).toBeCloseTo(163.293, 3);
    for (const who of [p.council, p.councilStaff]) {
      const res = await get(who);
      expect(res.status).toBe(200);
      expect(res.json.total_kg).toBeCloseTo(compost + leafDay, 2);
      expect(res.json.households).toBe(3); // g4 collected compost and came to the day
      expect(res.json.by_day).toEqual([expect.objectContaining({ day_id: councilDay, material: "leaves", households: 3, kg: expect.closeTo(leafDay, 3) })]);
    }
  });

  it("counts the platform's total from collected reservations only; giveaway check-ins apart", async () => {
    // Same sources as above: 30 US gal bags (common practice) × 1 lb/US gal leaves (Missouri
    // S&T), 45 lb bales and compost at 1,300 lb/yd³ (common practice), NIST factors.
    const supplier = 4 * 30 * LB + 6 * 30 * LB + 3 * 45 * LB + 12.5;
    const other = 5 * 30 * LB; // no bag size given: 30 US gal
    const councilCompost = (0.5 * 1300 * LB) / YD3; // the council's listing, reserved and collected
    const leafDay = 12 * 30 * LB; // checked in at the giveaway day: not in the home page's figure
    // 209.813 + 68.039 + 385.630 = 663.482 kg, worked by hand from the figures above.
    expect(supplier + other + councilCompost).toBeCloseTo(663.482, 2);
    expect(await platformDivertedKg()).toBeCloseTo(supplier + other + councilCompost, 2);
    expect(await platformGiveawayKg()).toBeCloseTo(leafDay, 2);
  });

  it("filters by month and answers a grower with nothing yet with zeros, not an error", async () => {
    const nov = await get(p.supplier, "?from=2026-11&to=2026-11");
    expect(nov.json.by_month.every((m: { month: string }) => m.month === "2026-11")).toBe(true);
    const empty = await get(p.grower);
    expect(empty.json).toMatchObject({ total_kg: 0, by_month: [], households: 0 });
  });

  const BAD: [string, string][] = [
    ["?from=2026-13", "from"],
    ["?to=26-11", "to"],
    ["?from=2026-11&to=2026-10", "to"],
  ];
  for (const [qs, field] of BAD) {
    it(`422 on ${field} for ${qs}`, async () => {
      const res = await get(p.supplier, qs);
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("is for people who give material: 401 for visitors, 403 for a gardener", async () => {
    expect((await get(null)).status).toBe(401);
    expect((await get(p.gardener)).status).toBe(403);
  });
  it("exports the same figures as CSV", async () => {
    const res = await diversionCsv.GET(await request("/api/reports/diversion.csv", { as: p.supplier }), { params: Promise.resolve({}) });
    expect(res.headers.get("content-type")).toContain("text/csv");
    const lines = (await res.text()).trim().split("\r\n");
    expect(lines[0]).toBe("month,material,kg,m3,households,collections");
    expect(lines).toHaveLength(5);
    expect(lines[1]).toMatch(/^2026-10,leaves,54\.43/);
    const byDay = await diversionCsv.GET(await request("/api/reports/diversion.csv?by=day", { as: p.council }), { params: Promise.resolve({}) });
    const dayLines = (await byDay.text()).trim().split("\r\n");
    expect(dayLines[0]).toBe("date,giveaway_day,material,kg,m3,households");
    expect(dayLines[1]).toMatch(/,leaves,163\.29/);
  });
});
