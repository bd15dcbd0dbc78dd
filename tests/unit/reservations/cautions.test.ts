import { describe, expect, it } from "vitest";
import { pickupCautions } from "@/lib/reservations/cautions";

// What a gardener reads on the reserve page. Worms are live animals and some earthworm species
// are invasive in some regions (common practice, no source); the handling advice must fit how
// the order reaches them, and the line deferring to local rules stays in every case.
const worms = { material: "worms", unit: "kg", unit_mass_kg: null };

describe("cautions on the reserve page for a live culture", () => {
  it("tells someone collecting to bring a container", () => {
    const text = pickupCautions({ ...worms, fulfilment: "pickup" }).join(" ");
    expect(text).toMatch(/bring a container/i);
    expect(text).toMatch(/live animals/);
    expect(text).toMatch(/invasive/);
    expect(text).toMatch(/local rules come first/);
  });

  it("collects by default, as a listing without a choice does", () => {
    expect(pickupCautions(worms)).toEqual(pickupCautions({ ...worms, fulfilment: "pickup" }));
  });

  it("tells someone whose order is posted about the parcel, not a container or a trip home", () => {
    const text = pickupCautions({ ...worms, fulfilment: "post" }).join(" ");
    expect(text).not.toMatch(/container|go straight home|collect/i);
    expect(text).toMatch(/parcel/);
    expect(text).toMatch(/live animals/);
    expect(text).toMatch(/invasive/);
    expect(text).toMatch(/species/);
    expect(text).toMatch(/local rules come first/);
  });

  it("leaves other materials as they were, whatever the fulfilment", () => {
    const straw = { material: "straw", unit: "bales", unit_mass_kg: 25 };
    expect(pickupCautions({ ...straw, fulfilment: "post" })).toEqual(pickupCautions(straw));
  });
});
