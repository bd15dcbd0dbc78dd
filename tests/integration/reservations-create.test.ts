// POST /api/reservations: the contract (201 shape, 409 insufficient_quantity, 422 over the
// per-reservation maximum), the table-driven error cases, and "Reserve all".
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser, listingQuantities } from "../factories";
import { POST, GET } from "@/app/api/reservations/route";
import { GET as getOne } from "@/app/api/reservations/[id]/route";
import { rendered, renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let gardener: { id: string };
let supplierOnly: { id: string };

beforeAll(async () => {
  ctx = await freshDb();
  gardener = await createUser({ roles: ["gardener"] });
  supplierOnly = await createUser({ roles: ["supplier"] });
});
afterAll(() => ctx.close());

const post = async (body: unknown, as: string | null = gardener.id) => call(POST, await request("/api/reservations", { body, as }));

describe("POST /api/reservations (one listing)", () => {
  it("holds the quantity and answers 201 with the reservation", async () => {
    const l = await createListing({ quantity_total: 10, max_per_reservation: 5 });
    const before = Date.now();
    const res = await post({ listing_id: l.id, quantity: 3 });
    expect(res.status).toBe(201);
    const r = res.json.reservation;
    expect(r).toMatchObject({ status: "held", listing_id: l.id, quantity: 3 });
    expect(typeof r.id).toBe("string");
    // A free request waits for the supplier's answer: SUPPLIER_REPLY_HOURS (48 h), well
    // before the week a pickup with no fixed time leaves (tests/integration/reservations-answer-windows.test.ts).
    const holdMs = new Date(r.hold_expires_at).getTime() - before;
    expect(holdMs).toBeGreaterThan(47.9 * 3_600_000);
    expect(holdMs).toBeLessThan(48.1 * 3_600_000);
    expect(res.json.checkout_url).toBeUndefined();
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 3, quantity_collected: 0 });
    // Not confirmed: no address, no pickup code, no supplier e-mail.
    expect(r.pickup.address).toBeUndefined();
    expect(r.pickup_code).toBeUndefined();
    expect(r.supplier.email).toBeUndefined();
    expect(JSON.stringify(res.json)).not.toContain("Secret Lane");
  });

  it("confirms at once on an auto-accept free listing and reveals the address to the gardener", async () => {
    const l = await createListing({ quantity_total: 4, auto_accept: true });
    const res = await post({ listing_id: l.id, quantity: 2 });
    expect(res.status).toBe(201);
    expect(res.json.reservation.status).toBe("confirmed");
    expect(res.json.reservation.pickup_code).toMatch(/^[A-Z2-9]{6}$/);
    expect(res.json.reservation.pickup.address).toContain("Secret Lane");
    const mail = await renderedRows(ctx.db("email_outbox").where("dedupe_key", "like", `res:${res.json.reservation.id}:%`));
    expect(mail.map((m: any) => m.template).sort()).toEqual(["reservation.confirmed", "reservation.confirmed"]);
    const toGardener = mail.find((m: any) => m.dedupe_key.endsWith(":gardener"));
    expect(toGardener.text_body).toContain("Secret Lane");
    expect(toGardener.text_body).toContain(res.json.reservation.pickup_code);
    expect(toGardener.html_body).toContain("Secret Lane");
  });

  it("writes the request e-mail for the supplier in the same transaction", async () => {
    const l = await createListing({ quantity_total: 4 });
    const res = await post({ listing_id: l.id, quantity: 1 });
    const mail = rendered(await ctx.db("email_outbox").where({ dedupe_key: `res:${res.json.reservation.id}:requested:supplier` }).first());
    expect(mail.subject).toContain("New request");
  });

  it("answers 409 insufficient_quantity when not enough is left, and holds nothing", async () => {
    const l = await createListing({ quantity_total: 2 });
    const res = await post({ listing_id: l.id, quantity: 3 });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("insufficient_quantity");
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 0 });
  });

  it("answers 422 over the listing's per-reservation maximum", async () => {
    const l = await createListing({ quantity_total: 20, max_per_reservation: 5 });
    const res = await post({ listing_id: l.id, quantity: 6 });
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("invalid_input");
    expect(res.json.error.fields.quantity).toMatch(/At most 5 bags/);
  });

  it("keeps a pickup window and its next opening", async () => {
    const l = await createListing({ windows: [{ kind: "weekly", weekday: 6, start_time: "09:00", end_time: "12:00" }] });
    const res = await post({ listing_id: l.id, quantity: 1, pickup_window_id: l.window_ids[0] });
    expect(res.status).toBe(201);
    const r = res.json.reservation;
    expect(r.pickup_window_id).toBe(l.window_ids[0]);
    expect(r.pickup.window).toBe("Saturdays 09:00–12:00");
    expect(new Date(r.pickup.starts_at).getUTCDay()).toBe(6);
    expect(new Date(r.pickup.ends_by).getTime() - new Date(r.pickup.starts_at).getTime()).toBe(3 * 3_600_000);
  });

  const cases: { name: string; body: unknown; as?: () => string | null; status: number; code: string; field?: string }[] = [
    { name: "not signed in", body: async () => ({ listing_id: (await createListing()).id, quantity: 1 }), as: () => null, status: 401, code: "unauthenticated" },
    { name: "a supplier without the gardener role", body: async () => ({ listing_id: (await createListing()).id, quantity: 1 }), as: () => supplierOnly.id, status: 403, code: "forbidden" },
    { name: "no quantity", body: async () => ({ listing_id: (await createListing()).id }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "zero quantity", body: async () => ({ listing_id: (await createListing()).id, quantity: 0 }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "a quantity as text", body: async () => ({ listing_id: (await createListing()).id, quantity: "2" }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "half a bale", body: async () => ({ listing_id: (await createListing({ unit: "bales" })).id, quantity: 1.5 }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "three decimals of m³", body: async () => ({ listing_id: (await createListing({ unit: "m3" })).id, quantity: 0.125 }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "a price under Stripe's minimum", body: async () => ({ listing_id: (await createListing({ unit: "kg", price_cents: 40 })).id, quantity: 1 }), status: 422, code: "invalid_input", field: "quantity" },
    { name: "no listing id", body: { quantity: 1 }, status: 422, code: "invalid_input", field: "listing_id" },
    { name: "an unknown listing", body: { listing_id: "00000000-0000-0000-0000-000000000000", quantity: 1 }, status: 404, code: "not_found" },
    { name: "a draft listing", body: async () => ({ listing_id: (await createListing({ status: "draft" })).id, quantity: 1 }), status: 404, code: "not_found" },
    { name: "a paused listing", body: async () => ({ listing_id: (await createListing({ status: "paused" })).id, quantity: 1 }), status: 409, code: "invalid_state" },
    { name: "my own listing", body: async () => ({ listing_id: (await createListing({ owner_id: gardener.id })).id, quantity: 1 }), status: 409, code: "conflict" },
    { name: "my organisation's listing", body: async () => { const boss = await createUser({ roles: ["council"] }); await ctx.db("memberships").insert({ organisation_id: boss.organisation_id, user_id: gardener.id, org_role: "staff", created_at: new Date().toISOString() }); return { listing_id: (await createListing({ owner_id: boss.id, organisation_id: boss.organisation_id })).id, quantity: 1 }; }, status: 409, code: "conflict" },
    { name: "another listing's window", body: async () => ({ listing_id: (await createListing()).id, quantity: 1, pickup_window_id: (await createListing({ windows: [{ kind: "weekly", weekday: 1, start_time: "09:00", end_time: "10:00" }] })).window_ids[0] }), status: 422, code: "invalid_input", field: "pickup_window_id" },
    { name: "a dated window in the past", body: async () => { const l = await createListing({ windows: [{ kind: "dated", starts_at: "2020-01-01T09:00:00Z", ends_at: "2020-01-01T10:00:00Z" }] }); return { listing_id: l.id, quantity: 1, pickup_window_id: l.window_ids[0] }; }, status: 422, code: "invalid_input", field: "pickup_window_id" },
    { name: "someone else's bed", body: async () => ({ listing_id: (await createListing()).id, quantity: 1, bed_id: "not-my-bed" }), status: 422, code: "invalid_input", field: "bed_id" },
  ];
  for (const c of cases) {
    it(`refuses ${c.name} with ${c.status}`, async () => {
      const body = typeof c.body === "function" ? await c.body() : c.body;
      const res = await post(body, c.as ? c.as() : gardener.id);
      expect(res.status).toBe(c.status);
      expect(res.json.error.code).toBe(c.code);
      expect(res.json.error.message).toEqual(expect.any(String));
      if (c.field) expect(Object.keys(res.json.error.fields)).toContain(c.field);
    });
  }

  it("answers 400 to a body that is not JSON", async () => {
    const res = await call(POST, await request("/api/reservations", { rawBody: "{nope", as: gardener.id }));
    expect(res.status).toBe(400);
    expect(res.json.error.code).toBe("bad_request");
  });
});

describe("POST /api/reservations with items (Reserve all)", () => {
  it("makes one reservation per item in one go", async () => {
    const a = await createListing({ quantity_total: 5 });
    const b = await createListing({ quantity_total: 5, unit: "m3" });
    const res = await post({ items: [{ listing_id: a.id, quantity: 2 }, { listing_id: b.id, quantity: 0.5 }] });
    expect(res.status).toBe(201);
    expect(res.json.reservations).toHaveLength(2);
    expect(res.json.reservations.map((r: any) => [r.listing_id, r.quantity, r.status])).toEqual([
      [a.id, 2, "held"],
      [b.id, 0.5, "held"],
    ]);
    expect(res.json.reservations[0].group_id).toBe(res.json.reservations[1].group_id);
    expect((await listingQuantities(b.id)).quantity_held).toBe(0.5);
  });

  it("holds nothing at all when one item cannot be had", async () => {
    const a = await createListing({ quantity_total: 5 });
    const b = await createListing({ quantity_total: 1 });
    const before = await ctx.db("reservations").count({ n: "*" });
    const res = await post({ items: [{ listing_id: a.id, quantity: 2 }, { listing_id: b.id, quantity: 2 }] });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("insufficient_quantity");
    expect((await listingQuantities(a.id)).quantity_held).toBe(0);
    expect(await ctx.db("reservations").count({ n: "*" })).toEqual(before);
  });

  it("names the failing item's field", async () => {
    const a = await createListing({ quantity_total: 5, max_per_reservation: 1 });
    const res = await post({ items: [{ listing_id: (await createListing()).id, quantity: 1 }, { listing_id: a.id, quantity: 2 }] });
    expect(res.status).toBe(422);
    expect(res.json.error.fields).toHaveProperty(["items.1.quantity"]);
  });

  it("takes a pickup window per item, and refuses another listing's window on that item", async () => {
    const start = new Date(Date.now() + 3 * 86_400_000).toISOString();
    const end = new Date(Date.now() + 3 * 86_400_000 + 7_200_000).toISOString();
    const a = await createListing({ quantity_total: 5, windows: [{ kind: "dated", starts_at: start, ends_at: end }] });
    const b = await createListing({ quantity_total: 5, windows: [{ kind: "dated", starts_at: start, ends_at: end }] });
    const wrong = await post({ items: [{ listing_id: a.id, quantity: 1, pickup_window_id: b.window_ids[0] }, { listing_id: b.id, quantity: 1 }] });
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.fields).toHaveProperty(["items.0.pickup_window_id"]);
    const res = await post({ items: [{ listing_id: a.id, quantity: 1, pickup_window_id: a.window_ids[0] }, { listing_id: b.id, quantity: 1 }] });
    expect(res.status).toBe(201);
    const rows = await ctx.db("reservations").whereIn("id", res.json.reservations.map((r: { id: string }) => r.id)).select("listing_id", "pickup_window_id");
    expect(rows.find((r: { listing_id: string }) => r.listing_id === a.id).pickup_window_id).toBe(a.window_ids[0]);
    expect(rows.find((r: { listing_id: string }) => r.listing_id === b.id).pickup_window_id).toBeNull();
  });

  it("names each stop's own problem at once, keeps the status of a refusal, and holds nothing", async () => {
    const fine = await createListing({ quantity_total: 5 });
    const ended = await createListing({ quantity_total: 5, available_until: "2020-01-01T00:00:00.000Z" });
    const culture = await createListing({ material_code: "worms", unit: "kg", price_cents: 3000, quantity_total: 3, quality: { species: "Eisenia fetida", pickup: false } });
    const items = [
      { listing_id: fine.id, quantity: 1 },
      { listing_id: ended.id, quantity: 1 },
      { listing_id: culture.id, quantity: 1, fulfilment: "post" },
    ];
    const res = await post({ items });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("invalid_state");
    expect(res.json.error.fields["items.1.listing_id"]).toMatch(/ended on/);
    expect(res.json.error.fields["items.2.ship_to"]).toMatch(/posted culture needs an address/);
    expect(res.json.error.fields).not.toHaveProperty(["items.0.listing_id"]);
    expect((await listingQuantities(fine.id)).quantity_held).toBe(0);

    // With the address given and the ended stop left out (a partial plan), both are held.
    const partial = await post({ items: [items[0], { ...items[2], ship_to: "12 Orchard Rise, Fernhollow FH2 3NE" }] });
    expect(partial.status).toBe(201);
    expect(partial.json.reservations.map((r: any) => r.listing_id)).toEqual([fine.id, culture.id]);
  });

  it("names the item that is short on its quantity, with the conflict's own message", async () => {
    const a = await createListing({ quantity_total: 5 });
    const b = await createListing({ quantity_total: 2 });
    const res = await post({ items: [{ listing_id: a.id, quantity: 1 }, { listing_id: b.id, quantity: 3 }] });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("insufficient_quantity");
    expect(res.json.error.fields["items.1.quantity"]).toBe(res.json.error.message);
  });

  it("refuses an empty list and the same listing twice", async () => {
    expect((await post({ items: [] })).status).toBe(422);
    const a = await createListing();
    const twice = await post({ items: [{ listing_id: a.id, quantity: 1 }, { listing_id: a.id, quantity: 1 }] });
    expect(twice.status).toBe(422);
    expect(twice.json.error.fields).toHaveProperty(["items.1.listing_id"]);
  });
});

describe("reading reservations", () => {
  it("lists my own and hides other people's (404)", async () => {
    const l = await createListing();
    const mine = (await post({ listing_id: l.id, quantity: 1 })).json.reservation;
    const other = await createUser({ roles: ["gardener"] });
    const list = await call(GET, await request("/api/reservations", { as: gardener.id }));
    expect(list.json.reservations.map((r: any) => r.id)).toContain(mine.id);
    const theirs = await call(GET, await request("/api/reservations", { as: other.id }));
    expect(theirs.json.reservations.map((r: any) => r.id)).not.toContain(mine.id);
    expect((await call(getOne, await request(`/api/reservations/${mine.id}`, { as: other.id }), { id: mine.id })).status).toBe(404);
    const asOwner = await call(getOne, await request(`/api/reservations/${mine.id}`, { as: l.owner_id }), { id: mine.id });
    expect(asOwner.status).toBe(200);
    expect(asOwner.json.reservation.side).toBe("supplier");
    expect(asOwner.json.reservation.actions).toEqual(["confirm", "decline", "cancel"]);
  });
});
