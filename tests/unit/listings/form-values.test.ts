import { describe, expect, it } from "vitest";
import { emptyForm, fromListing, toBody } from "@/components/listings/form-values";
import { BAG_M3, BALE_M3, POUND_KG } from "@/lib/calc/facts";
import { createListingSchema } from "@/lib/validation/listings";

const filled = () => ({
  ...emptyForm(),
  title: "Oak leaves",
  quantity: "8",
  quality: { ...emptyForm().quality, leaf_source: "garden" },
  location: { lat: 52.2, lng: 0.85 },
  address: "1 Cobble Row",
});

describe("the listing form's values", () => {
  it("become a body the shared schema accepts, with only the material's declarations", () => {
    const body = toBody(filled(), "metric");
    expect(body.quality).toEqual({ leaf_source: "garden" });
    expect(createListingSchema.safeParse(body).success).toBe(true);
  });
  it("convert imperial entries to SI: US gallons, cubic yards, pounds (NIST HB44 App. C)", () => {
    const bags = toBody({ ...filled(), unit_size: "30" }, "imperial");
    expect(bags.unit_size).toBeCloseTo(BAG_M3, 6); // 30 US gal = 0.113562 m³
    const volume = toBody({ ...filled(), unit: "m3", quantity: "1" }, "imperial");
    expect(volume.quantity).toBeCloseTo(0.764555, 6); // 1 yd³ = 0.764554857984 m³
    const straw = toBody(
      { ...filled(), material: "straw", unit: "bales", quantity: "10", unit_size: "5.25", unit_mass_kg: "44", quality: { ...filled().quality, herbicide_history: "unknown" } },
      "imperial",
    );
    expect(straw.unit_size).toBeCloseTo(BALE_M3, 6); // 5.25 ft³
    expect(straw.unit_mass_kg).toBeCloseTo(44 * POUND_KG, 3);
    expect(straw.quality).toEqual({ herbicide_history: "unknown" });
  });
  it("turn money into cents and dated windows into wall-clock instants", () => {
    const body = toBody(
      {
        ...filled(),
        priced: "priced",
        price_cents: "4.50",
        deposit_cents: "2",
        pickup_windows: [{ kind: "dated", weekday: "6", start_time: "", end_time: "", starts_at: "2027-03-14T10:00", ends_at: "2027-03-14T13:00" }],
      },
      "metric",
    );
    expect([body.price_cents, body.deposit_cents]).toEqual([450, 200]);
    expect(body.pickup_windows[0]).toEqual({ kind: "dated", starts_at: "2027-03-14T10:00:00Z", ends_at: "2027-03-14T13:00:00Z" });
    const free = toBody({ ...filled(), priced: "free", price_cents: "4.50" }, "metric");
    expect(free.price_cents).toBe(0);
  });
  it("come back from a stored listing in the reader's units", () => {
    const back = fromListing(
      {
        material: "leaves",
        title: "Oak leaves",
        description: "",
        unit: "m3",
        unit_size: null,
        unit_mass_kg: null,
        quantity_total: 0.764554857984,
        price_cents: 450,
        currency: "eur",
        deposit_cents: 0,
        max_per_reservation: null,
        auto_accept: true,
        pickup: { address: "1 Cobble Row", location: { lat: 52.2, lng: 0.85 } },
        available_from: null,
        available_until: "2027-06-30T23:59:59.999Z",
        quality: { leaf_source: "park" },
        pickup_windows: [{ kind: "weekly", weekday: 2, start_time: "17:00", end_time: "19:00", starts_at: null, ends_at: null }],
      },
      "imperial",
    );
    expect(back.quantity).toBe("1");
    expect([back.priced, back.price_cents, back.available_until, back.quality.leaf_source]).toEqual(["priced", "4.50", "2027-06-30", "park"]);
    expect(back.pickup_windows[0]).toMatchObject({ kind: "weekly", weekday: "2", start_time: "17:00" });
  });
});
