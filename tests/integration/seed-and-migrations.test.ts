import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { foreignKeysEnforced, tableNames } from "../helpers/engine";
import { isForeignKeyViolation } from "@/db/dialect";
import { seed } from "@/seeds/demo";
import { MATERIAL_CODES } from "@/lib/calc/facts";
import { PEOPLE } from "@/seeds/town";
import { platformDivertedKg } from "@/lib/services/figures/steps/platform-kilograms";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb();
});
afterAll(() => ctx.close());

const TABLES = ["materials", "organisations", "users", "user_roles", "memberships", "listings", "pickup_windows", "beds", "giveaway_days", "giveaway_slots", "giveaway_bookings", "grower_shipping", "reservations", "reservation_events", "reviews", "needs", "need_alerts"];

async function snapshot() {
  const out: Record<string, unknown[]> = {};
  for (const t of TABLES) out[t] = await ctx.db(t).select("*").orderBy(Object.keys((await ctx.db(t).first()) ?? { rowid: 1 })[0]);
  return out;
}

describe("demo seed", () => {
  it("creates the scenario, and a second run changes nothing", async () => {
    await seed(ctx.db);
    const first = await snapshot();
    await seed(ctx.db);
    const second = await snapshot();
    expect(second).toEqual(first);

    expect(first.listings.length).toBeGreaterThanOrEqual(40);
    const materials = new Set(first.listings.map((l: any) => l.material_code));
    for (const m of ["leaves", "straw", "cardboard", "worms", "grass_clippings", "coffee_grounds", "wood_chips", "manure"]) expect(materials).toContain(m);
    expect(first.listings.some((l: any) => l.price_cents === 0)).toBe(true);
    expect(first.listings.some((l: any) => l.price_cents > 0)).toBe(true);
    expect(first.materials.map((m: any) => m.code).sort()).toEqual([...MATERIAL_CODES].sort());
  });

  it("has one account per role, and a council of two staff", async () => {
    const roles = await ctx.db("user_roles").distinct("role");
    expect(roles.map((r: any) => r.role).sort()).toEqual(["council", "gardener", "grower", "moderator", "supplier"]);
    const staff = await ctx.db("memberships as m").join("organisations as o", "o.id", "m.organisation_id").where("o.kind", "council");
    expect(staff.length).toBe(2);
    expect(PEOPLE.slice(0, 5).map((p) => p.key)).toEqual(["gardener", "supplier", "grower", "council", "moderator"]);
  });

  it("has past pickups that the listings' quantities and the home page's figure agree with", async () => {
    const collected = await ctx.db("reservations").where({ status: "collected" });
    expect(collected.length).toBeGreaterThanOrEqual(5);
    for (const r of collected) {
      const l = await ctx.db("listings").first("quantity_collected", "quantity_total").where({ id: r.listing_id });
      expect(l.quantity_collected).toBeGreaterThanOrEqual(r.quantity);
      expect(l.quantity_collected).toBeLessThanOrEqual(l.quantity_total);
    }
    // 8 sheets × 0.8 m² × 0.5 kg/m² (from memory) = 3.2 kg; 7 bags of leaves × 30 US gal
    // × 1 lb/gal (Missouri S&T table) = 210 lb = 95.254 kg (NIST: 1 lb = 0.45359237 kg);
    // 10 kg of coffee grounds; 1 m³ of leaves = 264.172 US gal (NIST HB44, 231 in³) × 1 lb/gal
    // = 119.826 kg. In all 228.28 kg.
    expect(await platformDivertedKg()).toBeCloseTo(228.28, 1);
  });

  it("keeps every public point a few hundred metres from the exact one", async () => {
    const { distance, point } = await import("@turf/turf");
    for (const l of await ctx.db("listings").select("lat", "lng", "approx_lat", "approx_lng")) {
      const m = distance(point([l.lng, l.lat]), point([l.approx_lng, l.approx_lat]), { units: "meters" });
      expect(m).toBeGreaterThan(200);
      expect(m).toBeLessThan(500);
    }
  });
});

describe("migrations", () => {
  it("go down completely and up again", async () => {
    await ctx.db.migrate.rollback(undefined, true);
    expect(await tableNames(ctx.db)).toEqual([]);
    await ctx.db.migrate.latest();
    const afterUp = await tableNames(ctx.db);
    for (const t of [...TABLES, "reviews", "reservations", "payments", "webhook_events", "email_outbox", "audit_log", "listing_photos", "verification_tokens"]) expect(afterUp).toContain(t);
  });

  it("make the audit log append-only and keep quantities in range", async () => {
    await ctx.db("audit_log").insert({ action: "test", subject_type: "test", created_at: new Date().toISOString() });
    await expect(ctx.db("audit_log").update({ action: "changed" })).rejects.toThrow(/append-only/);
    await expect(ctx.db("audit_log").delete()).rejects.toThrow(/append-only/);
    await seed(ctx.db);
    const l = await ctx.db("listings").first("id", "quantity_total");
    await expect(ctx.db("listings").where({ id: l.id }).update({ quantity_held: l.quantity_total + 1 })).rejects.toThrow(/quantity/);
    await expect(ctx.db("listings").where({ id: l.id }).update({ quantity_held: -1 })).rejects.toThrow(/quantity/);
  });

  it("turn foreign keys on", async () => {
    expect(await foreignKeysEnforced(ctx.db)).toBe(true);
    await expect(ctx.db("user_roles").insert({ user_id: "missing", role: "gardener", status: "active", created_at: new Date().toISOString() })).rejects.toSatisfy(isForeignKeyViolation);
  });
});
