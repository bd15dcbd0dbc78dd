// The demo town's open needs: the council's demand map shows areas for leaves, compost and
// wood chips, every one from three or more households, and leaves out the households alone
// in their areas; each giveaway material gets a suggestion. On a fixed day, because the
// demo's dates are fixed too.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { seedId } from "@/seeds/ids";
import { councilDemand } from "@/lib/services/needs/council-demand";
import { cellOf } from "@/lib/needs/grid";
import type { CouncilStaff } from "@/lib/auth/council-access";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const council: CouncilStaff = { userId: seedId("user:council"), organisationId: seedId("org:council"), organisationName: "Fernhollow Town Council", isOwner: true };
const clock = () => new Date("2026-12-03T09:00:00Z");

beforeAll(async () => {
  ctx = await freshDb({ seed: true });
});
afterAll(() => ctx.close());

describe("the demo's demand map", () => {
  it("shows two leaf areas of three or more households, and not the household alone in Oakhurst Green", async () => {
    const d = await councilDemand(council, { material: "leaves" }, { db: ctx.db, clock });
    expect(d.cells.map((c) => c.people).sort()).toEqual([3, 4]);
    for (const c of d.cells) expect(c.area_km2).toBeGreaterThanOrEqual(1);
    const priya = await ctx.db("needs").first("lat", "lng").where({ owner_id: seedId("user:priya") });
    expect(d.cells.map((c) => c.id)).not.toContain(cellOf(priya.lat, priya.lng).id);
    // The busiest area (four households) sets the day; Little Sedge is beyond its catchment.
    expect(d.suggestion).toMatchObject({ material: "leaves", households: 4, slots: 1 });
    expect(new Date(`${d.suggestion!.date}T12:00:00Z`).getUTCDay()).toBe(6);
  });

  it("shows compost and wood chips too, each with a day to suggest", async () => {
    for (const material of ["compost", "wood_chips"] as const) {
      const d = await councilDemand(council, { material }, { db: ctx.db, clock });
      expect(d.cells).toHaveLength(1);
      expect(d.cells[0].people).toBe(3);
      expect(d.suggestion?.households).toBe(3);
    }
    const d = await councilDemand(council, { material: "leaves" }, { db: ctx.db, clock });
    expect(d.materials.filter((m) => m.people > 0).map((m) => m.material).sort()).toEqual(["compost", "leaves", "wood_chips"]);
  });

  it("keeps Ines's lone compost need off the map, with its one alert already found", async () => {
    const d = await councilDemand(council, { material: "compost" }, { db: ctx.db, clock });
    const ines = await ctx.db("needs").first("id", "lat", "lng").where({ owner_id: seedId("user:gardener") });
    expect(d.cells.map((c) => c.id)).not.toContain(cellOf(ines.lat, ines.lng).id);
    expect(await ctx.db("need_alerts").where({ need_id: ines.id }).count({ n: "*" })).toEqual([{ n: 1 }]);
  });
});
