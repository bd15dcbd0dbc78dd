// The need form's one crossing between what a gardener types and what the API takes.
import { describe, expect, it } from "vitest";
import { needFormValues, toNeedBody } from "@/components/needs/need-form-values";
import { openNeedFieldsSchema } from "@/lib/validation/needs";

describe("the need form", () => {
  it("fills a bed's unmet leaves in bags, and sends them back as m³", () => {
    const v = needFormValues("metric", { material: "leaves", quantity: 0.45, unit: "m3", radius_km: 15, bed_id: "bed-1" });
    expect(v).toMatchObject({ material: "leaves", quantity: "4", unit: "bags", radius_km: "15", bed_id: "bed-1", alerts: "daily" });
    const body = toNeedBody(v, "metric");
    // 4 bags of 30 US gal: NIST HB44, 1 gal = 231 in³ = 3.785411784 L, so 0.454249 m³.
    expect(body.quantity).toBeCloseTo(0.454249414, 8);
    expect(body).toMatchObject({ material: "leaves", unit: "m3", radius_km: 15, bed_id: "bed-1" });
    expect(openNeedFieldsSchema.safeParse(body).success).toBe(true);
  });

  it("takes miles and pounds from an imperial reader, and caps a radius it fills at 50 km", () => {
    const v = needFormValues("imperial", { material: "coffee_grounds", radius_km: 200 });
    // 50 km is 31.07 mi (NIST HB44: 1 mi = 1.609344 km), offered rounded down so it stays inside.
    expect(v.radius_km).toBe("31");
    const body = toNeedBody({ ...v, quantity: "22", location: { lat: 52.2, lng: 0.85 } }, "imperial");
    expect(body.quantity).toBeCloseTo(9.97903214, 8); // 22 × 0.45359237 kg (NIST HB44)
    expect(body.unit).toBe("kg");
    expect(body.radius_km).toBeCloseTo(49.889664, 6); // 31 × 1.609344
    expect(openNeedFieldsSchema.safeParse(body).success).toBe(true);
    // 31.1 mi is just past 50 km: the schema says so, as the route would.
    expect(openNeedFieldsSchema.safeParse(toNeedBody({ ...v, radius_km: "31.1", quantity: "22", location: { lat: 52.2, lng: 0.85 } }, "imperial")).error?.issues[0].path).toEqual(["radius_km"]);
  });

  it("leaves an empty amount as NaN for the schema to name", () => {
    const body = toNeedBody({ ...needFormValues("metric"), location: { lat: 52.2, lng: 0.85 } }, "metric");
    expect(Number.isNaN(body.quantity)).toBe(true);
    expect(openNeedFieldsSchema.safeParse(body).error?.issues.map((i) => i.path[0])).toContain("quantity");
  });
});
