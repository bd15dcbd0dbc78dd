import { describe, expect, it } from "vitest";
import { call, request } from "../helpers/http";
import * as estimateRoute from "@/app/api/estimate/route";
import * as blendRoute from "@/app/api/blend/route";

const post = async (handler: unknown, body: unknown, raw?: string) =>
  call(handler as never, await request("/api/x", raw !== undefined ? { rawBody: raw } : { body }));

describe("POST /api/estimate", () => {
  it("answers the contract's fields for a 3 × 1.2 m bed", async () => {
    const res = await post(estimateRoute.POST, { bed: { length_m: 3, width_m: 1.2 }, start_date: "2027-03-01", latitude: 51.5 });
    expect(res.status).toBe(200);
    expect(res.json.area_m2).toBeCloseTo(3.6, 6);
    const byMaterial = Object.fromEntries(res.json.needs.map((n: { material: string }) => [n.material, n]));
    expect(byMaterial.cardboard).toMatchObject({ unit: "m2" });
    expect(byMaterial.cardboard.quantity).toBeGreaterThanOrEqual(3.6);
    expect(Number.isInteger(byMaterial.cardboard.sheets)).toBe(true);
    // 3.6 m² × 0.125 m = 0.45 m³ of leaves; × 0.05 m = 0.18 m³ of straw (volume = area × depth).
    expect(byMaterial.leaves).toMatchObject({ unit: "m3", quantity: 0.45 });
    expect(byMaterial.straw).toMatchObject({ unit: "m3", quantity: 0.18 });
    expect(Number.isInteger(byMaterial.leaves.bags)).toBe(true);
    expect(Number.isInteger(byMaterial.straw.bales)).toBe(true);
    expect(byMaterial.worms).toMatchObject({ unit: "kg" });
    expect(res.json.water_l).toBeGreaterThan(0);
    expect(res.json.blend).toHaveProperty("cn_ratio");
    expect(res.json.blend).toHaveProperty("moisture_pct");
    expect(res.json.blend).toHaveProperty("advice");
    const keys = new Set(res.json.timeline.map((t: { key: string }) => t.key));
    for (const k of ["build", "moisture_check", "add_worms", "settling_check", "check_6_months", "ready", "top_up"]) expect(keys).toContain(k);
    expect(res.json.timeline[0]).toMatchObject({ key: "build", date: "2027-03-01" });
    expect(res.json.cautions.length).toBeGreaterThan(3);
  });

  it("leaves a layer out when it is false", async () => {
    const res = await post(estimateRoute.POST, { bed: { length_m: 2, width_m: 1 }, layers: { straw: false, worms: false } });
    expect(res.json.needs.map((n: { material: string }) => n.material)).toEqual(["cardboard", "leaves"]);
    expect(res.json.timeline.some((t: { key: string }) => t.key === "add_worms")).toBe(false);
  });

  it("takes a GeoJSON outline and its latitude", async () => {
    // A 10 m × 10 m square near the demo town (0.0001473° of longitude ≈ 10 m at 52.2°).
    const lat = 52.2;
    const dLat = 10 / 111_195;
    const dLng = 10 / (111_195 * Math.cos((lat * Math.PI) / 180));
    const ring = [[0.85, lat], [0.85 + dLng, lat], [0.85 + dLng, lat + dLat], [0.85, lat + dLat], [0.85, lat]];
    const res = await post(estimateRoute.POST, { bed: { polygon: { type: "Polygon", coordinates: [ring] } }, start_date: "2027-03-01" });
    expect(res.status).toBe(200);
    expect(res.json.area_m2).toBeGreaterThan(99);
    expect(res.json.area_m2).toBeLessThan(101);
  });

  // Squares drawn in metres near the demo town, for outlines with holes.
  const at = (mx: number, my: number) => [0.85 + mx / (111_195 * Math.cos((52.2 * Math.PI) / 180)), 52.2 + my / 111_195];
  const sq = (x: number, y: number, side: number) => [at(x, y), at(x + side, y), at(x + side, y + side), at(x, y + side), at(x, y)];
  const outline = (...rings: number[][][]) => ({ bed: { polygon: { type: "Polygon", coordinates: rings } } });

  it("takes an outline with a hole inside it and subtracts the hole", async () => {
    const res = await post(estimateRoute.POST, outline(sq(0, 0, 10), sq(3, 3, 4)));
    expect(res.status).toBe(200);
    // 10 m × 10 m less a 4 m × 4 m hole = 84 m² (plane geometry; Turf's sphere agrees within 0.5 %).
    expect(res.json.area_m2).toBeGreaterThan(84 * 0.995);
    expect(res.json.area_m2).toBeLessThan(84 * 1.005);
  });

  const BAD: [string, unknown, string][] = [
    ["a hole outside the outline", outline(sq(0, 0, 10), sq(20, 0, 5)), "bed.polygon"],
    ["a hole bigger than the outline", outline(sq(0, 0, 10), sq(-5, -5, 20)), "bed.polygon"],
    ["a hole as big as the outline", outline(sq(0, 0, 10), sq(0, 0, 10)), "bed.polygon"],
    ["a hole crossing the outline", outline(sq(0, 0, 10), sq(8, 2, 4)), "bed.polygon"],
    ["a hole touching the outline", outline(sq(0, 0, 10), sq(0, 3, 4)), "bed.polygon"],
    ["holes overlapping each other", outline(sq(0, 0, 10), sq(2, 2, 4), sq(4, 4, 4)), "bed.polygon"],
    ["a hole inside another hole", outline(sq(0, 0, 10), sq(2, 2, 6), sq(3, 3, 2)), "bed.polygon"],
    // An L with 4 m wide arms 1,200 m long: 9,584 m², under the area cap, but it spreads 1.2 km.
    ["an outline spreading 1,200 m", outline([at(0, 0), at(1200, 0), at(1200, 4), at(4, 4), at(4, 1200), at(0, 1200), at(0, 0)]), "bed.polygon"],
    ["an unknown layer", { bed: { length_m: 3, width_m: 1 }, layers: { plutonium: true } }, "layers.plutonium"],
    ["an unknown layer setting", { bed: { length_m: 3, width_m: 1 }, layers: { leaves: { depth: 10 } } }, "layers.leaves.depth"],
    ["an unknown cardboard setting", { bed: { length_m: 3, width_m: 1 }, layers: { cardboard: { overlap_mm: 150 } } }, "layers.cardboard.overlap_mm"],
    ["an unknown field", { bed: { length_m: 3, width_m: 1 }, colour: "red" }, "colour"],
    ["an unknown bed field", { bed: { length_m: 3, width_m: 1, height_m: 0.3 } }, "bed.height_m"],
    ["negative length", { bed: { length_m: -3, width_m: 1 } }, "bed.length_m"],
    ["zero width", { bed: { length_m: 3, width_m: 0 } }, "bed.width_m"],
    ["a bed over 10,000 m²", { bed: { length_m: 200, width_m: 60 } }, "bed"],
    ["a string for a size", { bed: { length_m: "three", width_m: 1 } }, "bed.length_m"],
    ["no bed", { layers: {} }, "bed"],
    ["an outline that crosses itself", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [0.001, 0.001], [0.001, 0], [0, 0.001], [0, 0]]] } } }, "bed.polygon.coordinates.0"],
    ["an outline that is not closed", { bed: { polygon: { type: "Polygon", coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.002]]] } } }, "bed.polygon.coordinates.0"],
    ["leaves deeper than 30 cm", { bed: { length_m: 3, width_m: 1 }, layers: { leaves: { depth_cm: 60 } } }, "layers.leaves"],
    ["straw thinner than 2 cm", { bed: { length_m: 3, width_m: 1 }, layers: { straw: { depth_cm: 1 } } }, "layers.straw"],
    ["overlap of 50 cm", { bed: { length_m: 3, width_m: 1 }, layers: { cardboard: { overlap_cm: 50 } } }, "layers.cardboard"],
    ["a start in the year 9999", { bed: { length_m: 3, width_m: 1 }, start_date: "9999-06-01" }, "start_date"],
    ["a start before 2000", { bed: { length_m: 3, width_m: 1 }, start_date: "1999-12-31" }, "start_date"],
    ["a date that does not exist", { bed: { length_m: 3, width_m: 1 }, start_date: "2027-02-30" }, "start_date"],
    ["latitude 100", { bed: { length_m: 3, width_m: 1 }, latitude: 100 }, "latitude"],
  ];
  for (const [label, body, field] of BAD) {
    it(`4xx with a message on ${field}: ${label}`, async () => {
      const res = await post(estimateRoute.POST, body);
      expect(res.status).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      const keys = Object.keys(res.json.error.fields);
      expect(keys.some((k) => k === field || k.startsWith(`${field}.`))).toBe(true);
    });
  }
  it("names an unknown layer in its message and lists the layers there are", async () => {
    const res = await post(estimateRoute.POST, { bed: { length_m: 3, width_m: 1 }, layers: { plutonium: true, leaves: true } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.json.error.fields)).toEqual(["layers.plutonium"]);
    expect(res.json.error.fields["layers.plutonium"]).toMatch(/"plutonium"/);
    expect(res.json.error.fields["layers.plutonium"]).toMatch(/cardboard.*leaves.*straw.*wood_chips.*worms/);
  });
  it("400 for malformed JSON", async () => {
    const res = await post(estimateRoute.POST, undefined, "{ bed: ");
    expect(res.status).toBe(400);
    expect(res.json.error.code).toBe("bad_request");
  });
});

describe("POST /api/blend", () => {
  it("mixes by the Cornell formula, with explicit values overriding the table", async () => {
    // Hand computation (Cornell Waste Management Institute, "Getting the Right Mix"):
    // A: 10 kg, 50 % moisture, 1 % N, C:N 50 → dry 5 kg, N 0.05 kg, C 2.5 kg
    // B: 10 kg, 50 % moisture, 4 % N, C:N 10 → dry 5 kg, N 0.2 kg,  C 2.0 kg
    // R = (2.5 + 2.0) / (0.05 + 0.2) = 18; moisture G = (5 + 5) / 20 = 50 %.
    const res = await post(blendRoute.POST, {
      components: [
        { material: "leaves", mass_kg: 10, moisture_pct: 50, n_pct: 1, cn_ratio: 50 },
        { mass_kg: 10, moisture_pct: 50, n_pct: 4, cn_ratio: 10 },
      ],
      target_moisture_pct: 60,
    });
    expect(res.status).toBe(200);
    expect(res.json.cn_ratio).toBeCloseTo(18, 1);
    expect(res.json.moisture_pct).toBeCloseTo(50, 1);
    expect(res.json.dry_mass_kg).toBeCloseTo(10, 3);
    expect(res.json.carbon_kg).toBeCloseTo(4.5, 3);
    expect(res.json.nitrogen_kg).toBeCloseTo(0.25, 3);
    // Water to 60 %: 10 kg dry / 0.4 = 25 kg total, so 5 kg = 5 L more.
    expect(res.json.water_to_target_l).toBeCloseTo(5, 2);
  });
  it("gives the full mass of a green that brings a pile into range, however much (the calculator's advice)", async () => {
    // 20 kg of straw alone: C:N 80 (NRAES-54 Table A.1). By Cornell's formula, with straw
    // at 12 % water, 0.7 % N, 56 % C and clippings at 82 %, 3.4 % N, 57.8 % C, reaching 40
    // takes q = (C − 40 N) / (d (40 n − c)) = (9.856 − 40 × 0.1232) / (0.18 × (1.36 − 0.578))
    // = 4.928 / 0.14076 = 35.01 kg of clippings, rounded up so it lands inside: 36 kg.
    const res = await post(blendRoute.POST, { components: [{ material: "straw", mass_kg: 20 }] });
    expect(res.json.advice).toMatch(/36 kg of grass clippings/);
  });
  it("leaves water_to_target_l out without a target", async () => {
    const res = await post(blendRoute.POST, { components: [{ material: "straw", mass_kg: 5 }] });
    expect(res.status).toBe(200);
    expect(res.json).not.toHaveProperty("water_to_target_l");
  });
  const BAD: [string, unknown, string][] = [
    ["unknown material", { components: [{ material: "plutonium", mass_kg: 1 }] }, "components.0.material"],
    ["negative mass", { components: [{ material: "leaves", mass_kg: -1 }] }, "components.0.mass_kg"],
    ["no components", { components: [] }, "components"],
    ["unnamed material without composition", { components: [{ mass_kg: 1 }] }, "components.0"],
    ["moisture over 99 %", { components: [{ material: "leaves", mass_kg: 1, moisture_pct: 120 }] }, "components.0.moisture_pct"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 with a message on ${field}: ${label}`, async () => {
      const res = await post(blendRoute.POST, body);
      expect(res.status).toBe(422);
      expect(Object.keys(res.json.error.fields).some((k) => k === field || k.startsWith(`${field}.`))).toBe(true);
    });
  }
});
