// A booking that passes the day's checks and then meets a change before its write: the write
// itself (takeSlotPlace's conditional UPDATE) must see that the day was called off or closed.
// The change is made from a second connection to the same database at the moment the booking
// reads its slot, i.e. after it has read the day and found it open — the gap a racing
// cancellation hits.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { otherConnection, type OtherConnection } from "../helpers/engine";
import { bookAs, createGiveaway, createUser } from "../factories";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let other: OtherConnection;
let council: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  other = otherConnection(ctx.env);
  council = (await createUser({ roles: ["council"] })).id;
});
afterAll(async () => {
  other.close();
  await ctx.close();
});

/** Runs `change` on the other connection just before the booking's read of its slot. */
function beforeSlotRead(change: () => void) {
  let done = false;
  const hook = (q: { sql: string }) => {
    if (!done && /^select .* from [`"]giveaway_slots[`"]/i.test(q.sql)) {
      done = true;
      change();
    }
  };
  ctx.db.on("query", hook);
  return {
    fired: () => done,
    off: () => ctx.db.removeListener("query", hook),
  };
}

async function bookWith(change: (dayId: string, slotId: string) => void) {
  const day = await createGiveaway(council);
  const household = (await createUser({ roles: ["gardener"] })).id;
  const slot = day.slots[0];
  const hook = beforeSlotRead(() => change(day.id, slot.id));
  try {
    const res = await bookAs(household, day.id, { slot_id: slot.id, quantity: 2 });
    expect(hook.fired()).toBe(true);
    const bookings = await ctx.db("giveaway_bookings").where({ day_id: day.id }).select("status");
    const { booked } = await ctx.db("giveaway_slots").where({ id: slot.id }).first("booked");
    return { res, bookings, booked };
  } finally {
    hook.off();
  }
}

describe("booking while the day changes under it", () => {
  it("books as usual when nothing changes (the hook alone refuses nothing)", async () => {
    const { res, bookings, booked } = await bookWith(() => {});
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(bookings).toEqual([{ status: "booked" }]);
    expect(booked).toBe(1);
  });

  it("fails cleanly with 409 when the day is called off between the check and the write", async () => {
    const { res, bookings, booked } = await bookWith((dayId) => {
      other.run("UPDATE giveaway_days SET status = 'cancelled', cancel_reason = 'Flooded', cancelled_at = ? WHERE id = ?", [new Date().toISOString(), dayId]);
    });
    expect(res.status, JSON.stringify(res.json)).toBe(409);
    expect(res.json.error.code).toBe("invalid_state");
    expect(res.json.error.message).toMatch(/called off/);
    expect(bookings).toEqual([]);
    expect(booked).toBe(0);
  });

  it("fails cleanly with 409 when booking closes between the check and the write", async () => {
    const { res, bookings, booked } = await bookWith((dayId) => {
      other.run("UPDATE giveaway_days SET booking_closes_at = ? WHERE id = ?", [new Date(Date.now() - 60_000).toISOString(), dayId]);
    });
    expect(res.status, JSON.stringify(res.json)).toBe(409);
    expect(res.json.error.code).toBe("invalid_state");
    expect(res.json.error.message).toMatch(/closed/);
    expect(bookings).toEqual([]);
    expect(booked).toBe(0);
  });

  it("still says slot_full when the last place goes between the check and the write", async () => {
    const { res, bookings } = await bookWith((_dayId, slotId) => {
      other.run("UPDATE giveaway_slots SET booked = capacity WHERE id = ?", [slotId]);
    });
    expect(res.status, JSON.stringify(res.json)).toBe(409);
    expect(res.json.error.code).toBe("slot_full");
    expect(bookings).toEqual([]);
  });
});
