import { describe, expect, it } from "vitest";
import { convertValues, defaultPlanValues, toRequest, valuesFromBed, type PlanValues } from "@/components/planner/form-model";
import { estimateSchema } from "@/lib/validation/estimate";
import { createBedSchema, updateBedSchema } from "@/lib/validation/beds";

// The estimate and bed schemas refuse keys they do not know, so whatever the planner form
// sends must be made of known keys only, for every shape and every layer switched on or off.
const outline = [
  { lat: 52.2, lng: 0.85 },
  { lat: 52.2, lng: 0.8502 },
  { lat: 52.2001, lng: 0.8502 },
  { lat: 52.2001, lng: 0.85 },
];

const variants = (base: PlanValues): PlanValues[] => [
  base,
  { ...base, shape: "outline", outline },
  { ...base, location: { lat: 52.2, lng: 0.85 } },
  { ...base, cardboard_on: false, leaves_on: false, straw_on: false, worms_on: false },
  { ...base, start_date: "" },
];

describe("the planner form's request", () => {
  for (const system of ["metric", "imperial"] as const) {
    it(`passes the strict estimate schema (${system})`, () => {
      for (const v of variants(defaultPlanValues(system, "2027-03-01"))) {
        const r = estimateSchema.safeParse(toRequest(v));
        expect(r.success ? [] : r.error.issues).toEqual([]);
      }
    });
  }

  it("is saved as a bed with the fields the save button adds, new or changed", () => {
    for (const v of variants(defaultPlanValues("metric", "2027-03-01"))) {
      const request = toRequest(v);
      // The body components/planner/save-bed.tsx sends.
      const body = { name: "Back fence", bed: request.bed, layers: request.layers, start_date: request.start_date ?? null, location: v.location };
      const created = createBedSchema.safeParse(body);
      expect(created.success ? [] : created.error.issues).toEqual([]);
      expect(updateBedSchema.safeParse(body).success).toBe(true);
    }
  });

  it("round-trips a saved bed's recipe through the form", () => {
    const bed = { shape: { length_m: 3, width_m: 1.2 }, layers: { leaves: { depth_cm: 20 }, straw: false }, start_date: "2027-03-01", location: null };
    const request = toRequest(valuesFromBed(bed, "metric", "2027-01-01"));
    expect(estimateSchema.safeParse(request).success).toBe(true);
    expect(request.layers).toMatchObject({ leaves: { depth_cm: 20 }, straw: false });
  });
});

// A recipe with every setting the bed schema takes, as a bed saved through the API may hold.
const FULL_RECIPE = {
  cardboard: { overlap_cm: 20, sheet_length_m: 1.2, sheet_width_m: 0.9 },
  leaves: { depth_cm: 15 },
  straw: { depth_cm: 7 },
  wood_chips: { depth_cm: 10 },
  worms: { kg_per_m2: 1.5 },
};

/** The body components/planner/save-bed.tsx sends for these form values. */
const saveBody = (v: PlanValues, name = "Back fence") => {
  const request = toRequest(v);
  return { name, bed: request.bed, layers: request.layers, start_date: request.start_date ?? null, location: v.location };
};

describe("editing a saved bed", () => {
  const saved = { shape: { length_m: 3, width_m: 1.2 }, layers: FULL_RECIPE, start_date: "2027-03-01", location: { lat: 52.2, lng: 0.85 } };

  for (const system of ["metric", "imperial"] as const) {
    it(`keeps every layer setting when saved untouched (${system})`, () => {
      const body = saveBody(valuesFromBed(saved, system, "2027-01-01"));
      const parsed = updateBedSchema.safeParse(body);
      expect(parsed.success ? [] : parsed.error.issues).toEqual([]);
      expect(body.layers).toEqual(FULL_RECIPE);
      expect(body.bed).toEqual({ length_m: 3, width_m: 1.2 });
    });

    it(`keeps them through a switch of units and back (${system})`, () => {
      const other = system === "metric" ? "imperial" : "metric";
      const there = valuesFromBed(saved, system, "2027-01-01");
      const back = convertValues(convertValues(there, system, other), other, system);
      expect(saveBody(back).layers).toEqual(FULL_RECIPE);
    });
  }

  it("shows the wood chips and the sheet size in the form, in the gardener's units", () => {
    const metric = valuesFromBed(saved, "metric", "2027-01-01");
    expect(metric).toMatchObject({ chips_on: true, chips_depth: "10", sheet_length: "120", sheet_width: "90", worms_stocking: "1.5" });
    const imperial = valuesFromBed(saved, "imperial", "2027-01-01");
    // 10 cm = 3.94 in and 120 cm = 47.24 in (1 in = 2.54 cm exactly, NIST SP 811 appendix B).
    expect(imperial).toMatchObject({ chips_on: true, chips_depth: "3.9", sheet_length: "47.2" });
  });

  it("sends a setting the gardener changed, and leaves a blank optional one to its default", () => {
    const v = valuesFromBed(saved, "metric", "2027-01-01");
    const body = saveBody({ ...v, chips_depth: "12", sheet_width: "", worms_stocking: "" });
    expect(body.layers).toEqual({ ...FULL_RECIPE, cardboard: { overlap_cm: 20, sheet_length_m: 1.2 }, wood_chips: { depth_cm: 12 }, worms: true });
  });

  it("keeps wood chips off for a bed without them, and lets the gardener turn them on", () => {
    const v = valuesFromBed({ ...saved, layers: { straw: false } }, "metric", "2027-01-01");
    expect(v.chips_on).toBe(false);
    expect(saveBody(v).layers?.wood_chips).toBe(false);
    expect(saveBody({ ...v, chips_on: true }).layers?.wood_chips).toEqual({ depth_cm: 7.5 });
  });
});

describe("a new plan", () => {
  it("starts an imperial gardener on a round bed in their own units, not the metric one converted", () => {
    const v = defaultPlanValues("imperial", "2027-03-01");
    // Not 9.84 × 3.94 ft (3 × 1.2 m); whole inches for the layers and the overlap.
    expect(v).toMatchObject({ length: "10", width: "4", overlap: "6", leaves_depth: "5", straw_depth: "2", chips_depth: "3" });
    // Sent as the exact metric values: 10 ft = 3.048 m and 4 ft = 1.2192 m (1 ft = 0.3048 m, NIST HB44 App. C).
    expect(toRequest(v).bed).toMatchObject({ length_m: 3.048, width_m: 1.2192 });
    expect(defaultPlanValues("metric", "2027-03-01")).toMatchObject({ length: "3", width: "1.2", leaves_depth: "12.5" });
  });
});

describe("switching units", () => {
  it("returns the same defaults after metric → imperial → metric, and imperial → metric → imperial", () => {
    for (const system of ["metric", "imperial"] as const) {
      const other = system === "metric" ? "imperial" : "metric";
      const start = defaultPlanValues(system, "2027-03-01");
      const back = convertValues(convertValues(start, system, other), other, system);
      for (const field of ["length", "width", "overlap", "leaves_depth", "straw_depth", "chips_depth"] as const) expect(back[field]).toBe(start[field]);
      expect(toRequest(back)).toEqual(toRequest(start));
    }
    // 12.5 cm shown as 4.9 in comes back as 12.5 cm, not 12.4 (4.9 × 2.54 = 12.446).
    const metric = defaultPlanValues("metric", "2027-03-01");
    expect(convertValues(metric, "metric", "imperial").leaves_depth).toBe("4.9");
    expect(convertValues(convertValues(metric, "metric", "imperial"), "imperial", "metric").leaves_depth).toBe("12.5");
  });

  it("keeps what the gardener typed through a round trip too", () => {
    const typed = { ...defaultPlanValues("metric", "2027-03-01"), leaves_depth: "17.3" };
    expect(convertValues(convertValues(typed, "metric", "imperial"), "imperial", "metric").leaves_depth).toBe("17.3");
  });

  it("sends a number typed in imperial units in those units, so its message comes back in them", () => {
    const v = { ...defaultPlanValues("imperial", "2027-03-01"), leaves_depth: "13", length: "12" };
    const request = toRequest(v);
    expect(request.layers?.leaves).toEqual({ depth_in: 13 });
    expect(request.bed).toMatchObject({ length_ft: 12 });
    expect(request.units).toBe("imperial");
    const r = estimateSchema.safeParse(request);
    expect(r.success ? [] : r.error.issues.map((i) => i.message)).toEqual(["depth must be at most 12 in"]);
  });
});
