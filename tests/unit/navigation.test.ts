import { describe, expect, it } from "vitest";
import { navFor, navGroupsFor } from "@/lib/auth/navigation";

describe("navigation by role", () => {
  const labels = (roles: Parameters<typeof navFor>[0]) => navFor(roles).map((l) => l.href);
  it("shows visitors only the public entries", () => {
    expect(labels(null)).toEqual(["/plan", "/mix", "/browse", "/giveaways"]);
  });
  it("adds each role's own area", () => {
    expect(labels(["gardener"])).toEqual(["/plan", "/mix", "/browse", "/giveaways", "/beds", "/reservations", "/needs"]);
    expect(labels(["supplier"])).toEqual(["/plan", "/mix", "/browse", "/giveaways", "/listings/mine", "/requests", "/reports"]);
    expect(labels(["grower"])).toContain("/requests");
    expect(labels(["council"])).toEqual(expect.arrayContaining(["/council", "/listings/mine", "/requests"]));
    expect(labels(["council"])).not.toContain("/reservations");
    expect(labels(["moderator"])).not.toContain("/requests");
    expect(labels(["moderator"])).toContain("/moderation");
    expect(labels(["gardener"])).not.toContain("/council");
    expect(labels(["grower"])).toEqual(expect.arrayContaining(["/grower", "/reports"]));
    expect(labels(["supplier"])).toContain("/reports");
    expect(labels(["gardener"])).not.toContain("/reports");
    expect(labels(["council"])).toContain("/reports");
    expect(labels(["moderator"])).not.toContain("/grower");
  });
});

describe("navigation gathered into menus by task", () => {
  const shape = (roles: Parameters<typeof navGroupsFor>[0]) => navGroupsFor(roles).map((e) => ("links" in e ? `${e.label}: ${e.links.map((l) => l.href).join(" ")}` : e.href));
  it("leaves a visitor's four links as they are", () => {
    expect(shape(null)).toEqual(["/plan", "/mix", "/browse", "/giveaways"]);
  });
  it("gathers a gardener's into building a bed and finding material", () => {
    expect(shape(["gardener"])).toEqual(["Build a bed: /plan /mix /beds", "Find material: /browse /giveaways /reservations /needs"]);
  });
  it("adds giving for suppliers and growers, and a desk of their own for councils and moderators", () => {
    expect(shape(["gardener", "grower"])).toEqual(["Build a bed: /plan /mix /beds", "Find material: /browse /giveaways /reservations /needs", "Give material: /listings/mine /requests /grower /reports"]);
    expect(shape(["council"])).toEqual(["Build a bed: /plan /mix", "Find material: /browse /giveaways", "Give material: /listings/mine /requests /reports", "/council"]);
    expect(shape(["moderator"])).toEqual(["/plan", "/mix", "/browse", "/giveaways", "/moderation"]);
  });
  it("keeps every link of the flat list, once", () => {
    for (const roles of [null, ["gardener"], ["supplier", "gardener"], ["council"], ["moderator"], ["gardener", "grower", "council", "moderator"]] as const) {
      const flat = navGroupsFor(roles).flatMap((e) => ("links" in e ? e.links : [e]));
      expect(flat.map((l) => l.href).sort()).toEqual(navFor(roles).map((l) => l.href).sort());
    }
  });
});
