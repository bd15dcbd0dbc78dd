// When a council leaves "booking closes" empty: 18:00 the evening before, unless that has
// passed — a day made for today, or for tomorrow after 18:00 — when booking stays open until
// the last slot starts. (18:00 the evening before: common practice, no source.)
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { createUser, giveawayBody } from "../factories";
import { ApiError } from "@/lib/api/errors";
import { createGiveaway } from "@/lib/services/giveaways/create-giveaway";
import { bookGiveaway } from "@/lib/services/giveaways/book-giveaway";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { createGiveawaySchema } from "@/lib/validation/giveaways";

// A January day: Europe/London is on UTC, so local times read the same as the instants.
const DAY = "2027-01-16";
const at = (iso: string) => () => new Date(iso);

let ctx: Awaited<ReturnType<typeof freshDb>>;
let council: CouncilStaff;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  const staff = await createUser({ roles: ["council"] });
  council = { userId: staff.id, organisationId: staff.organisation_id!, organisationName: "Test council", isOwner: true };
});
afterAll(() => ctx.close());

const input = (over: Record<string, unknown> = {}) => createGiveawaySchema.parse(giveawayBody({ date: DAY, deposit_cents: 0, ...over }));

async function refusal(p: Promise<unknown>) {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(ApiError);
  return err as ApiError;
}

describe("the default booking close", () => {
  it("is 18:00 the evening before when the day is made earlier than that", async () => {
    const day = await createGiveaway(council, input(), { clock: at("2027-01-15T17:00:00.000Z") });
    expect(day.booking_closes_at).toBe("2027-01-15T18:00:00.000Z");
  });

  it("is the last slot's start for a day made for tomorrow after 18:00, and a household can still book", async () => {
    const now = at("2027-01-15T19:30:00.000Z");
    const day = await createGiveaway(council, input(), { clock: now });
    // giveawayBody's slots start at 09:00 and 09:30.
    expect(day.booking_closes_at).toBe(`${DAY}T09:30:00.000Z`);
    const household = (await createUser({ roles: ["gardener"] })).id;
    const booking = await bookGiveaway(household, day.id, { slot_id: day.slots[1].id, quantity: 2 }, { clock: now });
    expect(booking.status).toBe("booked");
  });

  it("is the last slot's start for a day made for today before its slots", async () => {
    const day = await createGiveaway(council, input({ slots: [{ start: "13:00", end: "14:00", capacity: 5 }, { start: "10:00", end: "11:00", capacity: 5 }] }), { clock: at(`${DAY}T08:00:00.000Z`) });
    expect(day.booking_closes_at).toBe(`${DAY}T13:00:00.000Z`);
  });

  it("is the end of the day for a day made today with no slots yet", async () => {
    const day = await createGiveaway(council, input({ slots: [] }), { clock: at(`${DAY}T12:00:00.000Z`) });
    expect(day.booking_closes_at).toBe("2027-01-17T00:00:00.000Z");
  });

  it("refuses a day whose slots have all started, on the slots field", async () => {
    const err = await refusal(createGiveaway(council, input(), { clock: at(`${DAY}T09:45:00.000Z`) }));
    expect(err.code).toBe("invalid_input");
    expect(err.fields?.slots).toMatch(/\S/);
  });

  it("still refuses a closing time the council gives that is already past", async () => {
    const err = await refusal(createGiveaway(council, input({ booking_closes_at: "2027-01-15T18:00:00.000Z" }), { clock: at("2027-01-15T19:30:00.000Z") }));
    expect(err.fields?.booking_closes_at).toMatch(/\S/);
  });
});
