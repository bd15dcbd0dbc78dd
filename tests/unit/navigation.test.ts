import { describe, expect, it } from "vitest";
import { navFor } from "@/lib/auth/navigation";

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
