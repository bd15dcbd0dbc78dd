import { describe, expect, it } from "vitest";
import { blendSchema } from "@/lib/validation/blend";
import { estimateSchema } from "@/lib/validation/estimate";

const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => i.path.join("."));

const square = (side_deg: number, lat = 50) => ({
  type: "Polygon",
  coordinates: [[[0, lat], [side_deg, lat], [side_deg, lat + side_deg], [0, lat + side_deg], [0, lat]]],
});

describe("estimateSchema", () => {
  it("accepts a rectangle and an outline", () => {
    expect(estimateSchema.safeParse({ bed: { length_m: 4, width_m: 1.2 } }).success).toBe(true);
    const r = estimateSchema.parse({ bed: { polygon: square(0.0001) }, layers: { straw: false, leaves: { depth_cm: 10 } } });
    expect(r.bed).toHaveProperty("polygon");
  });

  it.each<[string, unknown, string]>([
    ["a negative length", { bed: { length_m: -1, width_m: 2 } }, "bed.length_m"],
    ["a zero width", { bed: { length_m: 1, width_m: 0 } }, "bed.width_m"],
    ["a string for a length", { bed: { length_m: "4", width_m: 2 } }, "bed.length_m"],
    ["an infinite length", { bed: { length_m: Number.POSITIVE_INFINITY, width_m: 2 } }, "bed.length_m"],
    ["an absurd side", { bed: { length_m: 1e9, width_m: 1e-9 } }, "bed.length_m"],
    ["a missing width", { bed: { length_m: 3 } }, "bed.width_m"],
    ["more than 10,000 m²", { bed: { length_m: 101, width_m: 100 } }, "bed"],
    ["a bed that is not an object", { bed: 12 }, "bed"],
    ["both an outline and sides", { bed: { polygon: square(0.0001), length_m: 2, width_m: 2 } }, "bed"],
    ["a self-crossing outline", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [0.001, 0.001], [0.001, 0], [0, 0.001], [0, 0]]] } } }, "bed.polygon.coordinates.0"],
    ["an open outline", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.001], [0.0001, 0]]] } } }, "bed.polygon.coordinates.0"],
    ["a ring with three positions", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [0.001, 0], [0, 0]]] } } }, "bed.polygon.coordinates.0"],
    ["a longitude out of range", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [190, 0], [190, 1], [0, 1], [0, 0]]] } } }, "bed.polygon.coordinates.0.1.0"],
    // 0.004° at 50° N: 445 m north–south by 286 m east–west, 12.7 ha but under the 500 m spread.
    ["an outline over a hectare", { bed: { polygon: square(0.004) } }, "bed.polygon"],
    // 0.009° of latitude is 1,001 m; 0.00005° of longitude at 50° N is 3.6 m: 0.36 ha.
    ["an outline spreading over 500 m", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 50], [0.00005, 50], [0.00005, 50.009], [0, 50.009], [0, 50]]] } } }, "bed.polygon"],
    ["not a Polygon", { bed: { polygon: { type: "Point", coordinates: [0, 0] } } }, "bed.polygon.type"],
    ["leaves too deep", { bed: { length_m: 2, width_m: 2 }, layers: { leaves: { depth_cm: 31 } } }, "layers.leaves.depth_cm"],
    ["straw too thin", { bed: { length_m: 2, width_m: 2 }, layers: { straw: { depth_cm: 1 } } }, "layers.straw.depth_cm"],
    ["chips too deep", { bed: { length_m: 2, width_m: 2 }, layers: { wood_chips: { depth_cm: 16 } } }, "layers.wood_chips.depth_cm"],
    ["an overlap under 10 cm", { bed: { length_m: 2, width_m: 2 }, layers: { cardboard: { overlap_cm: 5 } } }, "layers.cardboard.overlap_cm"],
    ["a tiny sheet", { bed: { length_m: 2, width_m: 2 }, layers: { cardboard: { sheet_width_m: 0.2 } } }, "layers.cardboard.sheet_width_m"],
    ["seams wider than half the sheet", { bed: { length_m: 2, width_m: 2 }, layers: { cardboard: { sheet_width_m: 0.35, sheet_length_m: 0.35, overlap_cm: 30 } } }, "layers.cardboard.overlap_cm"],
    ["a layer that is neither on/off nor settings", { bed: { length_m: 2, width_m: 2 }, layers: { straw: "yes" } }, "layers.straw"],
    ["a negative worm stocking", { bed: { length_m: 2, width_m: 2 }, layers: { worms: { kg_per_m2: -1 } } }, "layers.worms.kg_per_m2"],
    ["a date not on the calendar", { bed: { length_m: 2, width_m: 2 }, start_date: "2023-02-29" }, "start_date"],
    ["a latitude past the pole", { bed: { length_m: 2, width_m: 2 }, latitude: 91 }, "latitude"],
    ["a moisture target over 65 %", { bed: { length_m: 2, width_m: 2 }, target_moisture_pct: 70 }, "target_moisture_pct"],
    ["a moisture target under 40 %", { bed: { length_m: 2, width_m: 2 }, target_moisture_pct: 30 }, "target_moisture_pct"],
  ])("flags %s at %s", (_name, input, path) => {
    expect(paths(estimateSchema.safeParse(input))).toContain(path);
  });

  it("caps the positions of an outline and its holes together at 2,000", () => {
    // Three rings of 700 positions each: every ring is under the 1,000 per ring, the sum is not.
    const circle = (r: number) => {
      const pts = Array.from({ length: 699 }, (_, i) => [0.001 + r * Math.cos((2 * Math.PI * i) / 699), 50 + r * Math.sin((2 * Math.PI * i) / 699)]);
      return [...pts, pts[0]];
    };
    const polygon = { type: "Polygon", coordinates: [circle(0.0003), circle(0.0001), circle(0.00003)] };
    expect(paths(estimateSchema.safeParse({ bed: { polygon } }))).toContain("bed.polygon.coordinates");
    polygon.coordinates.pop();
    expect(estimateSchema.safeParse({ bed: { polygon } }).success).toBe(true);
  });

  it("says which limit an outline broke: the spread or the area", () => {
    const message = (input: unknown) => {
      const r = estimateSchema.safeParse(input);
      return r.success ? "" : r.error.issues.map((i) => i.message).join(" ");
    };
    expect(message({ bed: { polygon: square(0.004) } })).toMatch(/10,000 m²/);
    expect(message({ bed: { polygon: square(0.005) } })).toMatch(/500 m/); // 556 m north–south
    expect(estimateSchema.safeParse({ bed: { polygon: square(0.0008) } }).success).toBe(true); // 89 × 57 m
  });

  it("takes build days from 2000 to 2100 only", () => {
    const ok = (start_date: string) => estimateSchema.safeParse({ bed: { length_m: 2, width_m: 2 }, start_date }).success;
    expect(["2000-01-01", "2027-03-01", "2100-12-31"].map(ok)).toEqual([true, true, true]);
    expect(["1999-12-31", "2101-01-01", "9999-06-01", "0001-01-01"].map(ok)).toEqual([false, false, false, false]);
    const r = estimateSchema.safeParse({ bed: { length_m: 2, width_m: 2 }, start_date: "9999-06-01" });
    expect(r.error!.issues.map((i) => [i.path.join("."), i.message])).toEqual([["start_date", expect.stringMatching(/2000.*2100/)]]);
  });

  it("gives every issue a message", () => {
    const r = estimateSchema.safeParse({ bed: { length_m: -1 }, latitude: 100, layers: { leaves: { depth_cm: 0 } } });
    expect(r.success).toBe(false);
    for (const issue of r.error!.issues) expect(issue.message.length).toBeGreaterThan(0);
  });
});

describe("blendSchema", () => {
  it("accepts named materials and a fully described unnamed one", () => {
    const r = blendSchema.safeParse({
      components: [{ material: "leaves", mass_kg: 10 }, { mass_kg: 2, moisture_pct: 60, n_pct: 2, c_pct: 40 }],
      target_moisture_pct: 55,
    });
    expect(r.success).toBe(true);
  });

  it.each<[string, unknown, string]>([
    ["an unknown material", { components: [{ material: "sand", mass_kg: 1 }] }, "components.0.material"],
    ["no components", { components: [] }, "components"],
    ["too many components", { components: Array.from({ length: 51 }, () => ({ material: "leaves", mass_kg: 1 })) }, "components"],
    ["a zero mass", { components: [{ material: "leaves", mass_kg: 0 }] }, "components.0.mass_kg"],
    ["an absurd mass", { components: [{ material: "leaves", mass_kg: 2e6 }] }, "components.0.mass_kg"],
    ["moisture of 100 %", { components: [{ material: "leaves", mass_kg: 1, moisture_pct: 100 }] }, "components.0.moisture_pct"],
    ["nitrogen over 20 %", { components: [{ material: "leaves", mass_kg: 1, n_pct: 25 }] }, "components.0.n_pct"],
    ["a C:N over 2000", { components: [{ material: "leaves", mass_kg: 1, cn_ratio: 5000 }] }, "components.0.cn_ratio"],
    ["an unnamed component without moisture", { components: [{ mass_kg: 1, n_pct: 1, cn_ratio: 30 }] }, "components.0.moisture_pct"],
    ["an unnamed component without nitrogen", { components: [{ mass_kg: 1, moisture_pct: 50, cn_ratio: 30 }] }, "components.0.n_pct"],
    ["an unnamed component without carbon", { components: [{ mass_kg: 1, moisture_pct: 50, n_pct: 1 }] }, "components.0.cn_ratio"],
    ["compost without its analysis", { components: [{ material: "leaves", mass_kg: 1 }, { material: "compost", mass_kg: 1 }] }, "components.1.n_pct"],
    ["a target of 0 %", { components: [{ material: "leaves", mass_kg: 1 }], target_moisture_pct: 0 }, "target_moisture_pct"],
  ])("flags %s at %s", (_name, input, path) => {
    expect(paths(blendSchema.safeParse(input))).toContain(path);
  });
});

describe("estimateSchema in the request's own units", () => {
  const issues = (input: unknown) => {
    const r = estimateSchema.safeParse(input);
    return r.success ? [] : r.error.issues.map((i) => [i.path.join("."), i.message]);
  };
  const bed = { length_m: 2, width_m: 2 };

  it("answers a depth given in inches in inches: 13 in of leaves is over the 12 in limit (30 cm = 11.8 in, said as 12)", () => {
    expect(issues({ bed, layers: { leaves: { depth_in: 13 } } })).toEqual([["layers.leaves.depth_in", "depth must be at most 12 in"]]);
    expect(issues({ bed, layers: { leaves: { depth_cm: 31 } } })).toEqual([["layers.leaves.depth_cm", "depth must be at most 30 cm"]]);
    // 2 cm of straw is 0.79 in: said as 0.8 in.
    expect(issues({ bed, layers: { straw: { depth_in: 0.5 } } })).toEqual([["layers.straw.depth_in", "depth must be at least 0.8 in"]]);
  });

  it("takes 12 in as the 30 cm it stands for, and other imperial settings in SI (NIST HB44 inch and foot)", () => {
    const r = estimateSchema.parse({
      bed: { length_ft: 10, width_ft: 4 },
      layers: { leaves: { depth_in: 12 }, straw: { depth_in: 2 }, cardboard: { overlap_in: 6, sheet_length_in: 40, sheet_width_in: 30 }, worms: { oz_per_ft2: 1 } },
    });
    expect(r.bed).toEqual({ length_m: expect.closeTo(3.048, 9), width_m: expect.closeTo(1.2192, 9) });
    expect(r.layers!.leaves).toEqual({ depth_cm: 30 });
    expect(r.layers!.straw).toEqual({ depth_cm: expect.closeTo(5.08, 9) });
    expect(r.layers!.cardboard).toEqual({ overlap_cm: expect.closeTo(15.24, 9), sheet_length_m: expect.closeTo(1.016, 9), sheet_width_m: expect.closeTo(0.762, 9) });
    // 1 oz/ft² = 0.028349523 kg / 0.09290304 m² = 0.30515 kg/m².
    expect((r.layers!.worms as { kg_per_m2: number }).kg_per_m2).toBeCloseTo(0.30515, 5);
  });

  it("speaks feet, inches and ounces wherever the request did", () => {
    expect(issues({ bed: { length_ft: -3, width_ft: 4 } })).toEqual([["bed.length_ft", "length must be more than 0 ft"]]);
    // 10,000 m² = 107,639 ft², said to three figures.
    expect(issues({ bed: { length_ft: 400, width_ft: 300 } })).toEqual([["bed", "A bed can be at most 108,000 ft²"]]);
    expect(issues({ bed, layers: { cardboard: { overlap_in: 14 } } })[0]).toEqual(["layers.cardboard.overlap_in", "overlap must be at most 12 in"]);
    // A 14 in sheet takes seams of at most 7 in.
    expect(issues({ bed, layers: { cardboard: { sheet_length_in: 14, sheet_width_in: 14, overlap_in: 8 } } })).toEqual([
      ["layers.cardboard.overlap_in", "overlap must be at most half the sheet's shorter side, 7 in"],
    ]);
    // 5 kg/m² = 16.4 oz/ft².
    expect(issues({ bed, layers: { worms: { oz_per_ft2: 20 } } })).toEqual([["layers.worms.oz_per_ft2", "stocking must be at most 16.4 oz/ft²"]]);
  });

  it("refuses a measurement given both ways", () => {
    expect(issues({ bed, layers: { leaves: { depth_cm: 10, depth_in: 4 } } })).toEqual([["layers.leaves.depth_in", "Give depth_cm or depth_in, not both"]]);
    expect(issues({ bed: { length_m: 2, length_ft: 6, width_m: 1 } })).toEqual([["bed.length_ft", "Give length_m or length_ft, not both"]]);
  });
});
