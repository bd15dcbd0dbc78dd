// The worker's expiry jobs take each hold on its own: one that cannot be expired (a broken
// row, a database error) is logged and left for the next run, and the rest of the batch
// still expires instead of waiting behind it.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { refuseWrites } from "../helpers/engine";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { bookAs, createGiveaway, createListing, createReservation, createUser, listingQuantities } from "../factories";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { expireGiveawayDepositHolds } from "@/lib/services/giveaways/expire-deposit-holds";
import { db } from "@/db/index";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  pay = await startPayments();
});
afterAll(async () => {
  await pay.close();
  await ctx.close();
});
afterEach(() => {
  vi.restoreAllMocks();
});

const minutes = (n: number) => n * 60_000;
const errorsAbout = (spy: { mock: { calls: unknown[][] } }, id: string) => spy.mock.calls.filter((c) => c.map(String).join(" ").includes(id));

describe("expire-holds", () => {
  it("expires the other holds when one of them cannot be expired, and that one on a later run", async () => {
    const now = new Date();
    const holds: { id: string; listingId: string }[] = [];
    for (let i = 0; i < 3; i++) {
      const l = await createListing({ quantity_total: 4 });
      // The broken one is due first, so the others come after it in the batch.
      const r = await createReservation({ status: "held", listing_id: l.id, quantity: 1, hold_expires_at: new Date(now.getTime() - minutes(3 - i)).toISOString() });
      holds.push({ id: r.id, listingId: l.id });
    }
    // The first hold's listing no longer shows its quantity as held, so giving it back fails.
    await db()("listings").where({ id: holds[0].listingId }).update({ quantity_held: 0 });
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});

    expect(await expireHolds({ clock: () => now })).toEqual({ expired: 2 });

    const status = async (id: string) => (await db()("reservations").first("status").where({ id })).status;
    expect(await status(holds[0].id)).toBe("held"); // its transaction rolled back whole
    expect(await status(holds[1].id)).toBe("expired");
    expect(await status(holds[2].id)).toBe("expired");
    expect((await listingQuantities(holds[1].listingId)).quantity_held).toBe(0);
    expect((await listingQuantities(holds[2].listingId)).quantity_held).toBe(0);
    expect(errorsAbout(logged, holds[0].id)).toHaveLength(1);
    expect(await db()("email_outbox").where("dedupe_key", "like", `res:${holds[0].id}:%`)).toHaveLength(0);

    // Once the row is put right, the next run expires it.
    await db()("listings").where({ id: holds[0].listingId }).update({ quantity_held: 1 });
    expect(await expireHolds({ clock: () => new Date(now.getTime() + 1000) })).toEqual({ expired: 1 });
    expect(await status(holds[0].id)).toBe("expired");
    expect(logged.mock.calls.filter((c) => String(c[0]).includes("[expire-holds]"))).toHaveLength(1);
  });
});

describe("expire-giveaway-deposits", () => {
  it("lapses the other bookings when one of them cannot be lapsed, and that one on a later run", async () => {
    const council = await createUser({ roles: ["council"] });
    const day = await createGiveaway(council.id, { deposit_cents: 500, slots: [{ start: "09:00", end: "10:00", capacity: 5 }] });
    const slotId = day.slots[0].id;
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) {
      const household = await createUser({ roles: ["gardener"] });
      const res = await bookAs(household.id, day.id, { slot_id: slotId, quantity: 1 });
      expect(res.status).toBe(201);
      expect(res.json.booking.deposit_status).toBe("awaiting");
      ids.push(res.json.booking.id);
    }
    const booking = (id: string) => db()("giveaway_bookings").first("status", "deposit_status").where({ id });
    const booked = async () => (await db()("giveaway_slots").first("booked").where({ id: slotId })).booked;
    expect(await booked()).toBe(3);
    // The broken one is due first; any write to its row fails.
    const first = (await db()("giveaway_bookings").whereIn("id", ids).min({ t: "hold_expires_at" }))[0].t as string;
    await db()("giveaway_bookings").where({ id: ids[0] }).update({ hold_expires_at: new Date(Date.parse(first) - 1000).toISOString() });
    const mend = await refuseWrites(db(), { name: "test_broken_booking", table: "giveaway_bookings", event: "UPDATE", when: `OLD.id = '${ids[0]}'`, message: "broken booking row" });
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const later = new Date(Date.parse(first) + minutes(1));

    try {
      expect(await expireGiveawayDepositHolds({ clock: () => later })).toEqual({ expired: 2 });
    } finally {
      await mend();
    }

    expect(await booking(ids[0])).toMatchObject({ status: "booked", deposit_status: "awaiting" });
    expect(await booking(ids[1])).toMatchObject({ status: "cancelled", deposit_status: "unpaid" });
    expect(await booking(ids[2])).toMatchObject({ status: "cancelled", deposit_status: "unpaid" });
    expect(await booked()).toBe(1);
    expect(errorsAbout(logged, ids[0])).toHaveLength(1);

    expect(await expireGiveawayDepositHolds({ clock: () => later })).toEqual({ expired: 1 });
    expect(await booking(ids[0])).toMatchObject({ status: "cancelled", deposit_status: "unpaid" });
    expect(await booked()).toBe(0);
    await pay.fake.webhooksIdle();
  });
});
