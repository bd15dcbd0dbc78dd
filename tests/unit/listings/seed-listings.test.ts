import { describe, expect, it } from "vitest";
import { demoListings } from "@/seeds/listings";
import { createListingSchema } from "@/lib/validation/listings";
import { fieldErrors } from "@/lib/api/errors";

describe("the demo's listings", () => {
  it("each pass the same rules as a listing posted through the form", () => {
    for (const l of demoListings()) {
      const r = createListingSchema.safeParse({
        material: l.material,
        title: l.title,
        description: l.description,
        unit: l.unit,
        unit_size: l.unit_size,
        unit_mass_kg: l.unit_mass_kg,
        quantity: l.quantity_total,
        price_cents: l.price_cents,
        deposit_cents: l.deposit_cents,
        max_per_reservation: l.max_per_reservation,
        pack_size: l.pack?.size ?? null,
        pack_price_cents: l.pack?.price_cents ?? null,
        location: { lat: l.lat, lng: l.lng },
        address: l.address,
        quality: l.quality,
        pickup_windows: l.windows.map((w) => ({ kind: "weekly", weekday: w.weekday, start_time: w.start, end_time: w.end })),
      });
      expect(r.success ? {} : fieldErrors(r.error), `${l.key} ${l.title}`).toEqual({});
    }
  });

  it("sell some starter cultures by the pack and some by the kg, so both ways can be tried", () => {
    const worms = demoListings().filter((l) => l.material === "worms");
    expect(worms.some((l) => l.pack)).toBe(true);
    expect(worms.some((l) => !l.pack)).toBe(true);
  });
});
