// Retry-safe money-moving writes: an Idempotency-Key sent again by the same person within a
// day gets the first answer and holds, books or cancels nothing twice; the same key with a
// different request is a 409 with the error envelope.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createListing, createUser, listingQuantities } from "../factories";
import { POST as reserve } from "@/app/api/reservations/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";
import * as bookings from "@/app/api/giveaways/[id]/bookings/route";
import { pruneIdempotencyKeys } from "@/db/idempotency-keys";
import { IDEMPOTENCY_TTL_MS } from "@/lib/api/idempotency";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let gardener: string;
let other: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  gardener = (await createUser({ roles: ["gardener"] })).id;
  other = (await createUser({ roles: ["gardener"] })).id;
});
afterAll(() => ctx.close());

const post = async (body: unknown, key: string | null, as = gardener) =>
  call(reserve, await request("/api/reservations", { body, as, headers: key === null ? {} : { "Idempotency-Key": key } }));

const reservationsOf = (listingId: string) => ctx.db("reservations").where({ listing_id: listingId });

describe("POST /api/reservations with an Idempotency-Key", () => {
  it("answers a retry with the first answer and holds the quantity once", async () => {
    const l = await createListing({ quantity_total: 10 });
    const first = await post({ listing_id: l.id, quantity: 3 }, "key-retry-1");
    expect(first.status).toBe(201);
    // The connection dropped before the answer arrived; the client sends the same request again.
    const again = await call(reserve, await request("/api/reservations", { body: { quantity: 3, listing_id: l.id }, as: gardener, headers: { "Idempotency-Key": "key-retry-1" } }));
    expect(again.status).toBe(201);
    expect(again.json).toEqual(first.json);
    expect(await reservationsOf(l.id)).toHaveLength(1);
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 3 });
  });

  it("marks a replayed answer so a client can tell", async () => {
    const l = await createListing({ quantity_total: 10 });
    const req = async () => reserve(await request("/api/reservations", { body: { listing_id: l.id, quantity: 1 }, as: gardener, headers: { "Idempotency-Key": "key-header" } }), { params: Promise.resolve({}) });
    expect((await req()).headers.get("idempotent-replayed")).toBeNull();
    expect((await req()).headers.get("idempotent-replayed")).toBe("true");
  });

  it("holds once when 50 copies of one request arrive at the same moment", async () => {
    const l = await createListing({ quantity_total: 60 });
    const answers = await Promise.all(Array.from({ length: 50 }, () => post({ listing_id: l.id, quantity: 1 }, "key-burst")));
    expect(answers.map((a) => a.status)).toEqual(Array(50).fill(201));
    expect(new Set(answers.map((a) => a.json.reservation.id)).size).toBe(1);
    expect(await reservationsOf(l.id)).toHaveLength(1);
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 1 });
  });

  it("refuses the same key with a different body: 409 with the envelope, and nothing held", async () => {
    const l = await createListing({ quantity_total: 10 });
    expect((await post({ listing_id: l.id, quantity: 2 }, "key-mismatch")).status).toBe(201);
    const res = await post({ listing_id: l.id, quantity: 5 }, "key-mismatch");
    expect(res.status).toBe(409);
    expect(res.json).toEqual({ error: { code: "idempotency_mismatch", message: expect.stringMatching(/different request/) } });
    expect(await reservationsOf(l.id)).toHaveLength(1);
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 2 });
  });

  it("keeps each person's keys apart", async () => {
    const l = await createListing({ quantity_total: 10 });
    const mine = await post({ listing_id: l.id, quantity: 1 }, "key-shared");
    const theirs = await post({ listing_id: l.id, quantity: 1 }, "key-shared", other);
    expect(theirs.status).toBe(201);
    expect(theirs.json.reservation.id).not.toBe(mine.json.reservation.id);
    expect(await reservationsOf(l.id)).toHaveLength(2);
  });

  it("replays a refusal too: the first answer stands for the day", async () => {
    const l = await createListing({ quantity_total: 2 });
    const first = await post({ listing_id: l.id, quantity: 3 }, "key-refused");
    expect(first.status).toBe(409);
    expect(first.json.error.code).toBe("insufficient_quantity");
    const again = await post({ listing_id: l.id, quantity: 3 }, "key-refused");
    expect(again).toEqual(first);
  });

  it("runs a request again once its key is older than a day, and the worker prunes old keys", async () => {
    const l = await createListing({ quantity_total: 10 });
    await post({ listing_id: l.id, quantity: 1 }, "key-old");
    await ctx.db("idempotency_keys").where({ idem_key: "key-old" }).update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    expect((await post({ listing_id: l.id, quantity: 1 }, "key-old")).status).toBe(201);
    expect(await reservationsOf(l.id)).toHaveLength(2);
    expect(await pruneIdempotencyKeys(new Date(Date.now() + IDEMPOTENCY_TTL_MS + 1000).toISOString())).toBeGreaterThan(0);
    expect(await ctx.db("idempotency_keys").where({ idem_key: "key-old" })).toHaveLength(0);
  });

  it("runs every request without a key as its own", async () => {
    const l = await createListing({ quantity_total: 10 });
    await post({ listing_id: l.id, quantity: 1 }, null);
    await post({ listing_id: l.id, quantity: 1 }, null);
    expect(await reservationsOf(l.id)).toHaveLength(2);
  });

  it("refuses a malformed key with a 400 naming the header", async () => {
    const res = await post({ listing_id: "x", quantity: 1 }, "has a space");
    expect(res.status).toBe(400);
    expect(res.json.error.fields).toHaveProperty("Idempotency-Key");
  });

  it("tells a retry whose first request never finished (the process died) rather than run it twice", async () => {
    const l = await createListing({ quantity_total: 10 });
    const body = { listing_id: l.id, quantity: 1 };
    expect((await post(body, "key-stuck")).status).toBe(201);
    // As the key looks when the process died between running the request and keeping its answer.
    const started = new Date(Date.now() - 5 * 60_000).toISOString();
    await ctx.db("idempotency_keys").where({ idem_key: "key-stuck" }).update({ state: "running", response_status: null, response_body: null, created_at: started });
    const res = await post(body, "key-stuck");
    expect(res.status).toBe(409);
    expect(res.json.error).toMatchObject({ code: "request_in_progress", message: expect.stringMatching(/never finished/) });
    expect(await reservationsOf(l.id)).toHaveLength(1);
  });

  it("makes a copy that arrives while the first still runs wait for the first answer", async () => {
    const l = await createListing({ quantity_total: 10 });
    const body = { listing_id: l.id, quantity: 1 };
    const first = await post(body, "key-wait");
    const row = await ctx.db("idempotency_keys").first().where({ idem_key: "key-wait" });
    // The first is still running (its answer not yet kept) when the copy arrives, and finishes 300 ms later.
    await ctx.db("idempotency_keys").where({ idem_key: "key-wait" }).update({ state: "running", response_status: null, response_body: null });
    const finish = () => ctx.db("idempotency_keys").where({ idem_key: "key-wait" }).update({ state: "done", response_status: row.response_status, response_body: row.response_body });
    setTimeout(() => void finish().then(() => undefined), 300);
    const copy = await post(body, "key-wait");
    expect(copy).toEqual(first);
    expect(await reservationsOf(l.id)).toHaveLength(1);
  });
});

describe("the other money-moving writes", () => {
  it("cancels once: a retried cancel gets the first answer, not a 409", async () => {
    const l = await createListing({ quantity_total: 5 });
    const r = (await post({ listing_id: l.id, quantity: 2 }, "key-before-cancel")).json.reservation;
    const send = async () => call(cancel, await request(`/api/reservations/${r.id}/cancel`, { body: {}, as: gardener, headers: { "Idempotency-Key": "key-cancel" } }), { id: r.id });
    const first = await send();
    expect(first.status).toBe(200);
    expect(first.json.reservation.status).toBe("cancelled");
    expect(await send()).toEqual(first);
    expect(await ctx.db("reservation_events").where({ reservation_id: r.id, to_status: "cancelled" })).toHaveLength(1);
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 0 });
  });

  it("books a giveaway slot once for a repeated booking request", async () => {
    const council = (await createUser({ roles: ["council"] })).id;
    const day = await createGiveaway(council);
    const body = { slot_id: day.slots[0].id, quantity: 2 };
    const send = async () => call(bookings.POST as never, await request(`/api/giveaways/${day.id}/bookings`, { body, as: gardener, headers: { "Idempotency-Key": "key-book" } }), { id: day.id });
    const first = await send();
    expect(first.status).toBe(201);
    expect(await send()).toEqual(first);
    // Without the key the same request is a second booking attempt, refused by the household rule.
    expect((await bookAs(gardener, day.id, body)).json.error.code).toBe("household_limit");
    expect(await ctx.db("giveaway_bookings").where({ day_id: day.id })).toHaveLength(1);
  });
});
