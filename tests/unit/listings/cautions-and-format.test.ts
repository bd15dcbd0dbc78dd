import { describe, expect, it } from "vitest";
import { listingCautions } from "@/lib/calc/cautions";
import { describeUnitSize, formatListingQuantity, formatPrice, formatWindow } from "@/lib/listings/format";
import { BAG_M3, BALE_M3 } from "@/lib/calc/facts";

const kinds = (c: { kind: string }[]) => c.map((x) => x.kind);

describe("cautions on a listing", () => {
  it("straw: herbicide carryover with the bean or pea pot test, and lifting for bales", () => {
    const c = listingCautions({ material: "straw", unit: "bales", unit_mass_kg: 25, quality: { herbicide_history: "unknown" } });
    expect(kinds(c)).toEqual(["herbicide", "lifting", "gloves", "defer"]);
    expect(c[0].text).toMatch(/beans or peas in pots/);
    expect(c[0].text).toMatch(/does not know what was sprayed/);
    // NIOSH recommended weight limit: 51 lb (23 kg) under ideal conditions.
    expect(c[1].text).toMatch(/over the 23 kg \(51 lb\) NIOSH limit/);
  });
  it("bales under the NIOSH limit, and of unknown weight, still get a lifting note", () => {
    expect(listingCautions({ material: "straw", unit: "bales", unit_mass_kg: 15, quality: {} })[1].text).toMatch(/under the 23 kg/);
    const unknown = listingCautions({ material: "straw", unit: "bales", unit_mass_kg: null, quality: {} })[1].text;
    // 40–60 lb (common practice) is 18–27 kg; NIOSH's 23 kg falls inside it, so only the
    // heavier bales are over the limit: the note must not say all of them are "at or over".
    expect(unknown).toMatch(/18–27 kg/);
    expect(unknown).toMatch(/heavier ones are over the 23 kg \(51 lb\)/);
    expect(unknown).not.toMatch(/at or over/);
  });
  it("manure, grass clippings and compost carry the herbicide caution too", () => {
    for (const material of ["manure", "grass_clippings", "compost"] as const) {
      expect(kinds(listingCautions({ material, unit: "m3", unit_mass_kg: null, quality: { herbicide_history: "known_untreated" } }))).toContain("herbicide");
    }
  });
  it("leaves: roadside runoff, louder when they came from the street", () => {
    const garden = listingCautions({ material: "leaves", unit: "bags", unit_mass_kg: null, quality: { leaf_source: "garden" } });
    const street = listingCautions({ material: "leaves", unit: "bags", unit_mass_kg: null, quality: { leaf_source: "roadside" } });
    expect(kinds(garden)).toEqual(["roadside", "gloves", "defer"]);
    expect(street[0].text).toMatch(/came from a street or roadside/);
    expect(garden[0].text).not.toMatch(/came from a street/);
  });
  it("cardboard: tape and glossy print; worms: the species and local rules", () => {
    const board = listingCautions({ material: "cardboard", unit: "sheets", unit_mass_kg: null, quality: { tape_removed: false } });
    expect(board[0].text).toMatch(/tape, staples/);
    expect(board[0].text).toMatch(/still has tape/);
    expect(kinds(board)).not.toContain("gloves");
    const worms = listingCautions({ material: "worms", unit: "kg", unit_mass_kg: null, quality: { species: "Eisenia fetida" } });
    expect(worms.find((c) => c.kind === "worms")?.text).toMatch(/Eisenia fetida.*invasive/);
  });
});

describe("how listings read", () => {
  it("counts and volumes in the reader's units", () => {
    expect(formatListingQuantity(1, "bags")).toBe("1 bag");
    expect(formatListingQuantity(14, "bags")).toBe("14 bags");
    expect(formatListingQuantity(2.5, "m3")).toBe("2.5 m³");
    // 2.5 m³ / 0.764554857984 m³ per yd³ = 3.27 yd³ (NIST HB44 App. C yard).
    expect(formatListingQuantity(2.5, "m3", "imperial")).toBe("3.27 yd³");
    expect(formatListingQuantity(8, "kg", "imperial")).toBe("18 lb"); // 17.64 lb, shown to the pound
    // A third of a bag to the hundredth, a whole count without decimals (common practice, no source).
    expect(formatListingQuantity(1 / 3, "bags")).toBe("0.33 bags");
    expect(formatListingQuantity(3, "bales")).toBe("3 bales");
    expect(formatListingQuantity(0.999, "bales")).toBe("1 bale");
    expect(formatListingQuantity(1 / 3, "m3")).toBe("0.33 m³");
    expect(formatListingQuantity(0.004, "m3")).toBe("0.004 m³");
  });
  it("unit sizes", () => {
    // 30 US gal bag = 113.6 L (NIST: 1 gal = 3.785411784 L).
    expect(describeUnitSize("bags", BAG_M3, null)).toBe("bags of about 114 L");
    expect(describeUnitSize("bags", BAG_M3, null, "imperial")).toBe("bags of about 30 US gal");
    expect(describeUnitSize("bales", BALE_M3, 20, "imperial")).toBe("bales of 5.25 ft³, about 44 lb");
    expect(describeUnitSize("sheets", 0.8, null)).toBe("each sheet about 0.8 m²");
    expect(describeUnitSize("kg", null, null)).toBeNull();
  });
  it("prices and pickup windows", () => {
    expect(formatPrice(0, "eur", "bags")).toBe("Free");
    expect(formatPrice(450, "eur", "bales")).toBe("€4.50 a bale");
    expect(formatWindow({ kind: "weekly", weekday: 6, start_time: "09:00", end_time: "12:00" })).toBe("Saturdays 09:00–12:00");
    expect(formatWindow({ kind: "dated", starts_at: "2027-03-14T10:00:00Z", ends_at: "2027-03-14T13:00:00Z" })).toBe("Sun, 14 Mar 2027, 10:00–13:00");
  });
});

describe("cautions on a live-culture listing", () => {
  const worms = (quality: { ships?: boolean; pickup?: boolean }) =>
    listingCautions({ material: "worms", unit: "kg", unit_mass_kg: null, quality: { species: "Eisenia fetida", ...quality } });
  const text = (c: { kind: string; text: string }[]) => c.map((x) => x.text).join(" ");

  it("speaks of the parcel, not a container, when the worms are only posted", () => {
    const c = worms({ ships: true, pickup: false });
    expect(text(c)).toMatch(/parcel/);
    expect(text(c)).not.toMatch(/container/);
    // The live-animal and invasive-species caution and the local-rules line stay.
    expect(c.find((x) => x.kind === "worms")?.text).toMatch(/live animals.*invasive/);
    expect(kinds(c)).toContain("defer");
  });

  it("speaks of a container, not a parcel, when they are only collected", () => {
    const c = worms({ ships: false, pickup: true });
    expect(text(c)).toMatch(/container/);
    expect(text(c)).not.toMatch(/parcel/);
  });

  it("covers both when both are offered", () => {
    const c = worms({ ships: true, pickup: true });
    expect(text(c)).toMatch(/container/);
    expect(text(c)).toMatch(/parcel/);
  });
});
