import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser } from "../factories";
import * as shipping from "@/app/api/grower/shipping/route";
import * as culture from "@/app/api/grower/listings/[id]/culture/route";
import * as publicShipping from "@/app/api/growers/[id]/shipping/route";
import { cultureStock } from "@/lib/services/growers/list-culture-stock";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p: Record<string, string> = {};
let worms: string;
let leaves: string;
let theirWorms: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  p.grower = (await createUser({ roles: ["gardener", "grower"] })).id;
  p.other = (await createUser({ roles: ["grower"] })).id;
  p.gardener = (await createUser({ roles: ["gardener"] })).id;
  worms = (await createListing({ owner_id: p.grower, material_code: "worms", unit: "kg", quantity_total: 3, quality: { bedding: "shredded card" } })).id;
  leaves = (await createListing({ owner_id: p.grower, material_code: "leaves", unit: "bags" })).id;
  theirWorms = (await createListing({ owner_id: p.other, material_code: "worms", unit: "kg", quantity_total: 2 })).id;
});
afterAll(() => ctx.close());

const put = async (as: string | null, body: unknown) => call(shipping.PUT as never, await request("/x", { method: "PUT", body, as }));
const putCulture = async (as: string | null, id: string, body: unknown) => call(culture.PUT as never, await request("/x", { method: "PUT", body, as }), { id });

describe("shipping days and the weather pause", () => {
  it("defaults to early in the week, and buyers can read it", async () => {
    const res = await call(publicShipping.GET as never, await request("/x"), { id: p.grower });
    expect(res.json.shipping).toMatchObject({ ship_weekdays: [1, 2], ship_days: ["Monday", "Tuesday"], paused: false });
    expect((await call(publicShipping.GET as never, await request("/x"), { id: p.gardener })).status).toBe(404);
  });
  it("pauses posting in a heatwave, and says so to buyers", async () => {
    const res = await put(p.grower, { ship_weekdays: [1, 2, 3], paused: true, pause_reason: "heat", pause_note: "Back when it is under 25 °C." });
    expect(res.status).toBe(200);
    const seen = await call(publicShipping.GET as never, await request("/x"), { id: p.grower });
    expect(seen.json.shipping).toMatchObject({ paused: true, pause_reason: "heat", ship_weekdays: [1, 2, 3] });
    expect(seen.json.shipping.notice).toMatch(/paused because of a heatwave/);
    const audit = await ctx.db("audit_log").where({ action: "grower.shipping", actor_id: p.grower }).first();
    expect(JSON.parse(audit.after)).toMatchObject({ paused: true, pause_reason: "heat" });
  });
  const BAD: [string, unknown, string][] = [
    ["no days", { ship_weekdays: [], paused: false }, "ship_weekdays"],
    ["a day 7", { ship_weekdays: [7], paused: false }, "ship_weekdays.0"],
    ["the same day twice", { ship_weekdays: [1, 1], paused: false }, "ship_weekdays"],
    ["a pause without a reason", { ship_weekdays: [1], paused: true }, "pause_reason"],
    ["a reason not on the list", { ship_weekdays: [1], paused: true, pause_reason: "rain" }, "pause_reason"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 on ${field}: ${label}`, async () => {
      const res = await put(p.grower, body);
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("is for growers: 403 for a gardener, 401 for a visitor", async () => {
    expect((await put(p.gardener, { ship_weekdays: [1], paused: false })).status).toBe(403);
    expect((await put(null, { ship_weekdays: [1], paused: false })).status).toBe(401);
  });
});

describe("a worm listing's live-culture details", () => {
  it("requires the species, keeps the other declarations, and shows the stock with an estimated count", async () => {
    const missing = await putCulture(p.grower, worms, { ships: true, pickup: true });
    expect(missing.status).toBe(422);
    expect(missing.json.error.fields.species).toMatch(/\S/);
    expect((await putCulture(p.grower, worms, { species: "Eisenia fetida", ships: false, pickup: false })).json.error.fields.ships).toMatch(/\S/);
    const ok = await putCulture(p.grower, worms, { species: "Eisenia fetida", ships: true, pickup: false });
    expect(ok.status).toBe(200);
    const row = await ctx.db("listings").where({ id: worms }).first();
    expect(JSON.parse(row.quality)).toEqual({ bedding: "shredded card", species: "Eisenia fetida", ships: true, pickup: false });
    const [stock] = await cultureStock(p.grower);
    // About 1,000 worms per lb (common practice, no source): 3 kg ÷ 0.45359237 × 1,000 = 6,614 → 6,600.
    expect(stock).toMatchObject({ id: worms, kg_left: 3, species: "Eisenia fetida", ships: true, pickup: false, estimated_count: 6600 });
  });
  it("404 for another grower's listing or a listing that is not worms", async () => {
    expect((await putCulture(p.grower, theirWorms, { species: "Eisenia fetida", ships: true, pickup: true })).status).toBe(404);
    expect((await putCulture(p.grower, leaves, { species: "Eisenia fetida", ships: true, pickup: true })).status).toBe(404);
    expect((await putCulture(p.gardener, worms, { species: "Eisenia fetida", ships: true, pickup: true })).status).toBe(403);
  });
});
