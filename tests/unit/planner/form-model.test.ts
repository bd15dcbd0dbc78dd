import { describe, expect, it } from "vitest";
import { defaultPlanValues, toRequest, valuesFromBed, type PlanValues } from "@/components/planner/form-model";
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
