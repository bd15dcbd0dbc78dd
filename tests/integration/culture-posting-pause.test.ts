// Pausing posting for the weather tells every buyer whose parcel is waiting, once, in the
// same transaction as the pause; resuming tells them it goes out again. Shipped parcels,
// collections, unpaid holds and other growers' orders are left alone.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createReservation, createUser, type ReservationOpts } from "../factories";
import * as shipping from "@/app/api/grower/shipping/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";
import { db } from "@/db/index";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p = {} as Record<"grower" | "otherGrower", string>;
const o = {} as Record<"paid" | "packed" | "shipped" | "heldPaid" | "heldAwaiting" | "pickup" | "theirs", string>;
const ADDRESS = "Flat 2, 14 Quarry Row, Fernhollow FH2 7QT";
const PAUSE = { ship_weekdays: [1, 2], paused: true, pause_reason: "heat", pause_note: "Back once nights stay under 20 °C." };

async function order(listing_id: string, status: "held" | "confirmed", set: Omit<ReservationOpts, "listing_id" | "status">) {
  return (await createReservation({ status, listing_id, fulfilment: "post", ship_to: ADDRESS, pickup_by: null, ...set })).id;
}

beforeAll(async () => {
  ctx = await freshDb();
  p.grower = (await createUser({ roles: ["gardener", "grower"] })).id;
  p.otherGrower = (await createUser({ roles: ["grower"] })).id;
  const worms = (await createListing({ owner_id: p.grower, material_code: "worms", unit: "kg", quantity_total: 20, price_cents: 1600 })).id;
  const theirWorms = (await createListing({ owner_id: p.otherGrower, material_code: "worms", unit: "kg", quantity_total: 20 })).id;
  o.paid = await order(worms, "confirmed", { order_stage: "paid", payment_state: "paid", amount_cents: 3200 });
  o.packed = await order(worms, "confirmed", { order_stage: "packed", payment_state: "paid", amount_cents: 1600 });
  o.shipped = await order(worms, "confirmed", { order_stage: "shipped", payment_state: "paid", amount_cents: 1600, carrier: "Fernhollow Parcel Post", tracking: "FPP 1" });
  o.heldPaid = await order(worms, "held", { order_stage: null, payment_state: "paid", amount_cents: 1600 });
  o.heldAwaiting = await order(worms, "held", { order_stage: null, payment_state: "awaiting", amount_cents: 1600 });
  o.pickup = await order(worms, "confirmed", { order_stage: "paid", payment_state: "paid", amount_cents: 1600, fulfilment: "pickup", ship_to: null });
  o.theirs = await order(theirWorms, "confirmed", { order_stage: "paid" });
});
afterAll(() => ctx.close());

const put = async (body: unknown) => call(shipping.PUT as never, await request("/x", { method: "PUT", body, as: p.grower }));
const mailsOf = (id: string, kind: string) =>
  renderedRows(db()("email_outbox").select("to_address", "template", "data").where("dedupe_key", "like", `order:${id}:${kind}:%`));
const emailOf = async (reservationId: string) => (await db()("reservations as r").join("users as u", "u.id", "r.gardener_id").first("u.email").where("r.id", reservationId)).email;

describe("pausing posting with parcels waiting", () => {
  it("e-mails each waiting buyer once, with the grower's note and what they may do, and no one else", async () => {
    expect((await put(PAUSE)).status).toBe(200);
    for (const id of [o.paid, o.packed, o.heldPaid]) {
      const mails = await mailsOf(id, "posting_paused");
      expect(mails, id).toHaveLength(1);
      expect(mails[0].to_address).toBe(await emailOf(id));
      expect(mails[0].template).toBe("culture.posting_paused");
      expect(mails[0].subject).toMatch(/^Posting paused/);
      for (const body of [mails[0].text_body, mails[0].html_body]) {
        expect(body).toContain("Back once nights stay under 20 °C.");
        expect(body).toMatch(/paused posting because of a heatwave/);
        expect(body).toMatch(/waits with .* until posting resumes/);
      }
    }
    for (const id of [o.shipped, o.heldAwaiting, o.pickup, o.theirs]) expect(await mailsOf(id, "posting_paused"), id).toEqual([]);
  });

  it("says only what the cancel rule allows: a full refund before packing, the messages once packed", async () => {
    const [paid] = await mailsOf(o.paid, "posting_paused");
    expect(paid.text_body).toMatch(/cancel the order .* until .* packs it, and the €32\.00 you paid is refunded in full/);
    const [packed] = await mailsOf(o.packed, "posting_paused");
    expect(packed.text_body).toMatch(/packed it already, so it can no longer be cancelled/);
    expect(packed.text_body).not.toMatch(/refunded/);
    // The rule the packed e-mail describes is the one the cancel route applies.
    const buyer = (await db()("reservations").first("gardener_id").where({ id: o.packed })).gardener_id;
    const res = await call(cancel, await request("/x", { as: buyer, body: {} }), { id: o.packed });
    expect(res.status).toBe(409);
  });

  it("mails nobody when the same pause is saved again, even with a new note", async () => {
    const before = await db()("email_outbox").count({ n: "*" }).first();
    expect((await put(PAUSE)).status).toBe(200);
    expect((await put({ ...PAUSE, pause_note: "Still too hot; Tuesday at the earliest." })).status).toBe(200);
    expect(await db()("email_outbox").count({ n: "*" }).first()).toEqual(before);
    for (const id of [o.paid, o.packed, o.heldPaid]) expect(await mailsOf(id, "posting_paused")).toHaveLength(1);
  });

  it("tells the same buyers when posting resumes, once, and a later pause is news again", async () => {
    expect((await put({ ship_weekdays: [1, 2], paused: false })).status).toBe(200);
    expect((await put({ ship_weekdays: [1, 2, 3], paused: false })).status).toBe(200);
    for (const id of [o.paid, o.packed, o.heldPaid]) {
      const mails = await mailsOf(id, "posting_resumed");
      expect(mails, id).toHaveLength(1);
      expect(mails[0].subject).toMatch(/^Posting again/);
      expect(mails[0].text_body).toMatch(/It goes out on \w+day \d+ \w+ at the earliest/);
    }
    for (const id of [o.shipped, o.heldAwaiting, o.pickup, o.theirs]) expect(await mailsOf(id, "posting_resumed"), id).toEqual([]);

    await new Promise((r) => setTimeout(r, 5)); // a new pause is named by the moment it is saved
    expect((await put({ ...PAUSE, pause_reason: "frost", pause_note: null })).status).toBe(200);
    const second = await mailsOf(o.paid, "posting_paused");
    expect(second).toHaveLength(2);
    expect(second.some((m) => /because of frost/.test(m.text_body))).toBe(true);
  });
});
