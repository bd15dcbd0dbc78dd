// Cultures sold by the pack: counting whole packs, their price, how they read, and how the
// form, the one-click amount for a need and the match use them. The prices are invented
// demo numbers; the checks are arithmetic on them, not on a constant of the code.
import { describe, expect, it } from "vitest";
import { formatListingPrice, formatPackPrice, packCount, packQuantity, packsCovering, packsIn, packOf, unitPriceOfPack, wholePackProblem, wholePacks } from "@/lib/listings/packs";
import { listingPrice } from "@/lib/payments/money";
import { amountToReserve } from "@/lib/needs/coverage";
import { reservableQuantity } from "@/lib/reservations/labels";
import { emptyForm, fromListing, toBody } from "@/components/listings/form-values";
import { createListingSchema } from "@/lib/validation/listings";
import { POUND_KG } from "@/lib/calc/facts";
import { matchPlan } from "@/lib/match/plan";
import { candidateListing } from "../../factories/listings";
import { FERNHOLLOW } from "../../helpers/match";

const HALF = { size: 0.5, price_cents: 1600 };

describe("a pack", () => {
  it("is read from the two columns, both or neither", () => {
    expect(packOf({ pack_size: 0.5, pack_price_cents: 1600 })).toEqual(HALF);
    // PostgreSQL's numeric strings read the same.
    expect(packOf({ pack_size: "0.5", pack_price_cents: "1600" })).toEqual(HALF);
    expect(packOf({ pack_size: 0.5, pack_price_cents: null })).toBeNull();
    expect(packOf({ pack_size: null, pack_price_cents: 1600 })).toBeNull();
    expect(packOf({})).toBeNull();
  });

  it("counts whole packs only", () => {
    expect(packsIn(1.5, HALF)).toBe(3);
    expect(packsIn(0.7, HALF)).toBeNull();
    expect(packsIn(0, HALF)).toBeNull();
    // 3 × 0.3 is 0.8999999999999999 in binary floating point, and still three packs.
    expect(packsIn(3 * 0.3, { size: 0.3, price_cents: 1 })).toBe(3);
    expect(packQuantity(3, { size: 0.3, price_cents: 1 })).toBe(0.9);
    expect(wholePacks(1.2, HALF)).toBe(2);
    expect(wholePacks(0.49, HALF)).toBe(0);
    expect(packsCovering(0.7, HALF)).toBe(2);
    expect(packsCovering(1, HALF)).toBe(2);
  });

  it("keeps the price per kg it works out at, to the cent", () => {
    expect(unitPriceOfPack(HALF)).toBe(3200); // €16.00 ÷ 0.5 kg
    expect(unitPriceOfPack({ size: 0.3, price_cents: 1000 })).toBe(3333); // €33.333… a kg
  });

  it("prices whole packs at the pack price, and part of a pack as a whole one", () => {
    expect(listingPrice({ price_cents: 3333, pack: { size: 0.3, price_cents: 1000 } }, 9)).toBe(30000); // 30 packs × €10.00
    expect(listingPrice({ price_cents: 3200, pack: HALF }, 0.7)).toBe(3200); // two packs
    expect(listingPrice({ price_cents: 3200, pack: null }, 0.7)).toBe(2240); // per kg: 0.7 × €32.00
  });

  it("reads in the viewer's units, the listing's own after it", () => {
    expect(formatPackPrice(HALF, "eur", "kg")).toBe("€16.00 a 0.5 kg pack");
    // 0.5 kg ÷ 0.45359237 kg/lb (NIST HB44 App. C) = 1.10 lb.
    // The listing's own weight in brackets is held together by a no-break space, so a narrow
    // column never leaves "(0.5" on one line and "kg)" on the next.
    expect(formatPackPrice(HALF, "eur", "kg", "imperial")).toBe("€16.00 a 1.1 lb pack (0.5\u00a0kg)");
    expect(formatListingPrice({ price_cents: 3200, currency: "eur", unit: "kg", pack: HALF })).toBe("€16.00 a 0.5 kg pack");
    expect(formatListingPrice({ price_cents: 3200, currency: "eur", unit: "kg", pack: null })).toBe("€32.00 a kg");
    expect(packCount(1)).toBe("1 pack");
    expect(packCount(3)).toBe("3 packs");
  });

  it("says what a whole number of packs is when given part of one", () => {
    expect(wholePackProblem(1, HALF, "kg")).toBeNull();
    expect(wholePackProblem(0.7, HALF, "kg")).toMatch(/whole packs of 0\.5 kg: reserve 0\.5 kg, 1 kg, 1\.5 kg/);
    expect(wholePackProblem(0.7, HALF, "kg", "imperial")).toMatch(/1\.1 lb \(0\.5\u00a0kg\)/);
  });

  it("leaves only whole packs to reserve", () => {
    expect(reservableQuantity(1.2, "kg", HALF)).toBe(1);
    expect(reservableQuantity(1.2, "kg", null)).toBe(1.2);
    expect(reservableQuantity(2.7, "bales", null)).toBe(2);
  });
});

describe("one click for a need", () => {
  const culture = { material: "worms" as const, unit: "kg" as const, unit_size: null, unit_mass_kg: null, available: 3, max_per_reservation: null, pack: HALF };
  it("reserves enough whole packs", () => {
    expect(amountToReserve(0.7, "kg", culture)).toBe(1);
    expect(amountToReserve(0.5, "kg", culture)).toBe(0.5);
  });
  it("no more than the whole packs left or the cap allows", () => {
    expect(amountToReserve(5, "kg", { ...culture, available: 1.2 })).toBe(1);
    expect(amountToReserve(5, "kg", { ...culture, max_per_reservation: 1.5 })).toBe(1.5);
    expect(amountToReserve(5, "kg", { ...culture, available: 0.4 })).toBe(0);
  });
});

describe("the listing form", () => {
  const worms = () => ({
    ...emptyForm("worms"),
    material: "worms" as const,
    unit: "kg" as const,
    title: "Starter packs",
    quantity: "4",
    quality: { ...emptyForm().quality, species: "Eisenia fetida" },
    location: { lat: 52.2, lng: 0.85 },
    address: "1 Cobble Row",
    priced: "per_pack" as const,
    pack_size: "0.5",
    pack_price_cents: "16",
  });

  it("sends the pack in kg and cents, and no price per kg of its own", () => {
    const body = toBody(worms(), "metric");
    expect(body).toMatchObject({ pack_size: 0.5, pack_price_cents: 1600, price_cents: 0 });
    expect(createListingSchema.safeParse(body).success).toBe(true);
  });

  it("turns a pack typed in pounds into kg to the gram (NIST HB44 App. C: 1 lb = 0.45359237 kg)", () => {
    const body = toBody({ ...worms(), quantity: "10", pack_size: "1" }, "imperial");
    expect(body.pack_size).toBe(0.454);
    expect(createListingSchema.safeParse(body).success).toBe(true);
    expect(POUND_KG).toBeCloseTo(0.45359237, 8);
  });

  it("asks for the pack's weight and price rather than listing the culture free", () => {
    const r = createListingSchema.safeParse(toBody({ ...worms(), pack_size: "", pack_price_cents: "" }, "metric"));
    expect(r.success).toBe(false);
    const paths = r.success ? [] : r.error.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["pack_size", "pack_price_cents"]));
  });

  it("sends no pack once the grower goes back to a price per kg", () => {
    expect(toBody({ ...worms(), priced: "priced", price_cents: "30" }, "metric")).toMatchObject({ pack_size: null, pack_price_cents: null, price_cents: 3000 });
  });

  it("opens a stored pack listing on per pack, in the reader's units", () => {
    const stored = {
      material: "worms" as const,
      title: "Starter packs",
      description: "",
      unit: "kg" as const,
      unit_size: null,
      unit_mass_kg: null,
      quantity_total: 4,
      price_cents: 3200,
      pack: HALF,
      currency: "eur",
      deposit_cents: 0,
      max_per_reservation: null,
      auto_accept: false,
      pickup: { address: "1 Cobble Row", location: { lat: 52.2, lng: 0.85 } },
      available_from: null,
      available_until: null,
      quality: { species: "Eisenia fetida" },
      pickup_windows: [],
    };
    expect(fromListing(stored, "metric")).toMatchObject({ priced: "per_pack", pack_size: "0.5", pack_price_cents: "16.00" });
    expect(fromListing(stored, "imperial").pack_size).toBe("1.102"); // 0.5 ÷ 0.45359237
  });
});

describe("a plan with a culture sold by the pack", () => {
  const at = (dLat: number) => ({ lat: FERNHOLLOW.lat + dLat, lng: FERNHOLLOW.lng });
  const packed = candidateListing(FERNHOLLOW, { id: "packs", material: "worms", unit: "kg", unit_size: null, unit_mass_kg: null, available: 3, max_per_reservation: null, price_cents: 2400, pack: { size: 0.5, price_cents: 1200 }, location: at(0.01) });

  it("takes whole packs and prices them by the pack", () => {
    const plan = matchPlan([{ material: "worms", quantity: 0.7, unit: "kg" }], [packed], FERNHOLLOW);
    expect(plan.unmet).toEqual([]);
    expect(plan.allocations[0]).toMatchObject({ listing_id: "packs", packs: 2, listing_quantity: 1, quantity: 1, cost_cents: 2400, item_kg: null });
  });

  it("tops up with loose worms rather than pay for a pack it barely needs", () => {
    // 0.7 kg: two packs cost €24.00; one pack and 0.2 kg at €30.00 a kg at the same place cost
    // €12.00 + €6.00 = €18.00.
    const loose = candidateListing(FERNHOLLOW, { id: "loose", material: "worms", unit: "kg", unit_size: null, unit_mass_kg: null, available: 3, max_per_reservation: null, price_cents: 3000, location: at(0.01) });
    const plan = matchPlan([{ material: "worms", quantity: 0.7, unit: "kg" }], [packed, loose], FERNHOLLOW);
    const by = Object.fromEntries(plan.allocations.map((a) => [a.listing_id, a]));
    expect(by.packs).toMatchObject({ packs: 1, listing_quantity: 0.5, cost_cents: 1200 });
    expect(by.loose).toMatchObject({ packs: null, listing_quantity: 0.2, cost_cents: 600 });
    expect(plan.totals.price_cents).toBe(1800);
  });

  it("does not count part of a pack as supply", () => {
    const short = { ...packed, available: 1.2 };
    const plan = matchPlan([{ material: "worms", quantity: 2, unit: "kg" }], [short], FERNHOLLOW);
    expect(plan.allocations[0]).toMatchObject({ packs: 2, listing_quantity: 1 });
    expect(plan.unmet).toEqual([{ material: "worms", quantity: 1, unit: "kg" }]);
  });
});
