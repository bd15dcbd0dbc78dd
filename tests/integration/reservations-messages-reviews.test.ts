// The thread on a reservation (plain text, rate limited, e-mailed) and the reviews after
// a collection (each side once, 1–5), whose average is what listings show.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createReservation, createUser } from "../factories";
import { GET as getMessages, POST as postMessage } from "@/app/api/reservations/[id]/messages/route";
import { POST as review } from "@/app/api/reservations/[id]/review/route";
import { ratingsFor } from "@/db/reviews";
import { postReservationMessage } from "@/lib/services/reservations/post-reservation-message";
import { MESSAGE_LIMIT } from "@/lib/reservations/policy";
import { db } from "@/db/index";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let supplier: { id: string };
let gardener: { id: string };
let stranger: { id: string };

beforeAll(async () => {
  ctx = await freshDb();
  supplier = await createUser({ roles: ["supplier"] });
  gardener = await createUser({ roles: ["gardener"] });
  stranger = await createUser({ roles: ["gardener", "supplier"] });
});
afterAll(() => ctx.close());

async function reservation(status: "held" | "confirmed" | "collected" | "expired" = "confirmed") {
  const l = await createListing({ owner_id: supplier.id });
  return createReservation({ status, listing_id: l.id, gardener_id: gardener.id });
}
const send = async (id: string, as: string | null, body: unknown) => call(postMessage, await request(`/api/reservations/${id}/messages`, { as, body }), { id });

describe("messages", () => {
  it("posts a plain-text message, lists the thread for both sides and e-mails the other side", async () => {
    const r = await reservation();
    const res = await send(r.id, gardener.id, { body: "  Can I come at 5? <b>not bold</b>  " });
    expect(res.status).toBe(201);
    expect(res.json.message.body).toBe("Can I come at 5? <b>not bold</b>");
    await send(r.id, supplier.id, { body: "Yes, side gate." });
    const asSupplier = await call(getMessages, await request(`/x`, { as: supplier.id }), { id: r.id });
    expect(asSupplier.json.messages.map((m: any) => [m.side, m.mine, m.body])).toEqual([
      ["gardener", false, "Can I come at 5? <b>not bold</b>"],
      ["supplier", true, "Yes, side gate."],
    ]);
    const mails = await renderedRows(db()("email_outbox").where({ template: "reservation.message" }).andWhere("dedupe_key", "like", `res:${r.id}:%`).orderBy("created_at"));
    expect(mails).toHaveLength(2);
    const toSupplier = mails.find((m: any) => m.dedupe_key.includes(":supplier:"));
    expect(toSupplier.text_body).toContain("Can I come at 5?");
    // Shown as text in the HTML part, never as markup.
    expect(toSupplier.html_body).toContain("&lt;b&gt;not bold&lt;/b&gt;");
  });

  it("limits each person to a few messages in ten minutes (429), then lets them write again", async () => {
    const r = await reservation();
    const t0 = new Date();
    for (let i = 0; i < MESSAGE_LIMIT.count; i++) await postReservationMessage({ reservationId: r.id, userId: gardener.id, body: `m${i}` }, { clock: () => new Date(t0.getTime() + i * 1000) });
    const over = await send(r.id, gardener.id, { body: "one more" });
    expect(over.status).toBe(429);
    expect(over.json.error.code).toBe("rate_limited");
    // The other side is not limited by the gardener's messages.
    expect((await send(r.id, supplier.id, { body: "fine" })).status).toBe(201);
    const later = await postReservationMessage({ reservationId: r.id, userId: gardener.id, body: "later" }, { clock: () => new Date(t0.getTime() + (MESSAGE_LIMIT.windowMinutes + 1) * 60_000) });
    expect(later.body).toBe("later");
  });

  const cases = [
    { name: "an empty message", as: () => gardener.id, body: { body: "   " }, status: 422 },
    { name: "a message over 2,000 characters", as: () => gardener.id, body: { body: "x".repeat(2001) }, status: 422 },
    { name: "no body", as: () => gardener.id, body: {}, status: 422 },
    { name: "someone not on the reservation", as: () => stranger.id, body: { body: "hi" }, status: 404 },
    { name: "nobody signed in", as: () => null, body: { body: "hi" }, status: 401 },
  ];
  for (const c of cases) {
    it(`refuses ${c.name} with ${c.status}`, async () => {
      const r = await reservation();
      const res = await send(r.id, c.as(), c.body);
      expect(res.status).toBe(c.status);
    });
  }

  it("does not show a thread to a stranger", async () => {
    const r = await reservation();
    expect((await call(getMessages, await request(`/x`, { as: stranger.id }), { id: r.id })).status).toBe(404);
  });
});

describe("reviews", () => {
  const rate = async (id: string, as: string | null, body: unknown) => call(review, await request(`/api/reservations/${id}/review`, { as, body }), { id });

  it("lets each side review once after collection, and the supplier's average follows", async () => {
    const r = await reservation("collected");
    const g = await rate(r.id, gardener.id, { rating: 5, comment: "Dry, clean leaves." });
    expect(g.status).toBe(201);
    expect(g.json.review).toMatchObject({ rating: 5, subject_id: supplier.id, author_id: gardener.id });
    const s = await rate(r.id, supplier.id, { rating: 4, comment: "On time." });
    expect(s.json.review.subject_id).toBe(gardener.id);
    const again = await rate(r.id, gardener.id, { rating: 1 });
    expect([again.status, again.json.error.code]).toEqual([409, "conflict"]);

    const r2 = await reservation("collected");
    await rate(r2.id, gardener.id, { rating: 2 });
    // The supplier collects from someone else too, and that grower rates them 1 as a gardener:
    // listings show only what gardeners said of them as a supplier.
    const otherListing = await createListing({ owner_id: stranger.id });
    const asGardener = await createReservation({ status: "collected", listing_id: otherListing.id, gardener_id: supplier.id });
    expect((await rate(asGardener.id, stranger.id, { rating: 1 })).status).toBe(201);
    const ratings = await ratingsFor([supplier.id, gardener.id]);
    expect(ratings.get(supplier.id)).toEqual({ average: 3.5, count: 2 });
    // The gardener has supplied nothing, so has no supplier rating to show.
    expect(ratings.has(gardener.id)).toBe(false);
  });

  it("keeps one review when the same person submits twice at once", async () => {
    const r = await reservation("collected");
    const results = await Promise.all([rate(r.id, gardener.id, { rating: 4 }), rate(r.id, gardener.id, { rating: 4 })]);
    expect(results.map((x) => x.status).sort()).toEqual([201, 409]);
    expect(await db()("reviews").where({ reservation_id: r.id })).toHaveLength(1);
  });

  for (const [name, body, status] of [
    ["a rating of 0", { rating: 0 }, 422],
    ["a rating of 6", { rating: 6 }, 422],
    ["a rating of 3.5", { rating: 3.5 }, 422],
    ["a rating as text", { rating: "5" }, 422],
    ["a comment over 1,000 characters", { rating: 5, comment: "x".repeat(1001) }, 422],
  ] as const) {
    it(`refuses ${name}`, async () => {
      const r = await reservation("collected");
      const res = await rate(r.id, gardener.id, body);
      expect(res.status).toBe(status);
      expect(res.json.error.fields).toHaveProperty(Object.keys(body).includes("comment") ? "comment" : "rating");
    });
  }

  it("opens only after collection, and only to the two sides", async () => {
    const held = await reservation("confirmed");
    expect((await rate(held.id, gardener.id, { rating: 5 })).status).toBe(409);
    const done = await reservation("collected");
    expect((await rate(done.id, stranger.id, { rating: 5 })).status).toBe(404);
    expect((await rate(done.id, null, { rating: 5 })).status).toBe(401);
  });
});
