// Migration 008 carries its own copy of the public-point offset, so a database built later gets
// the points a database migrated then got. This checks the copy was faithful when it was
// frozen: if lib/geo's offset is ever changed on purpose, that change comes with a migration of
// its own, and this check is replaced by one of the new migration.
import { describe, expect, it } from "vitest";
import { approximatePoint } from "@/lib/geo/approximate";
import { frozenApproximatePoint } from "@/migrations/20261202_008_place_keyed_offsets";

describe("the offset frozen into migration 008", () => {
  it("gives the same public points as lib/geo for places anywhere and any key", () => {
    const places = [
      { owner: "user:a", lat: 52.2051, lng: 0.8472 },
      { owner: "org:council", lat: 52.2051, lng: 0.8472 },
      { owner: "user:b", lat: -33.8688, lng: 151.2093 },
      { owner: "user:c", lat: 64.1466, lng: -21.9426 },
      { owner: "user:d", lat: 0.0004, lng: -179.9996 },
    ];
    for (const key of ["a-key-for-the-test", "another-key-entirely"]) {
      for (const p of places) expect(frozenApproximatePoint(p, key)).toEqual(approximatePoint(p, key));
    }
  });

  it("moves a point, and by a different amount for another key", () => {
    const p = { owner: "user:a", lat: 52.2051, lng: 0.8472 };
    const one = frozenApproximatePoint(p, "k1");
    expect(one).not.toEqual({ lat: p.lat, lng: p.lng });
    expect(frozenApproximatePoint(p, "k2")).not.toEqual(one);
  });
});
