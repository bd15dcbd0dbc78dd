import "server-only";
import { db, newId } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { insertDay, insertSlots, slotsOf, findDay } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError } from "@/lib/api/errors";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import { addDays, localDate, zonedToUtc } from "@/lib/time/zoned";
import type { CreateGiveawayInput, SlotInput } from "@/lib/validation/giveaways";
import { staffDayView } from "@/lib/giveaways/view";
import type { CouncilContext } from "@/lib/auth/council-access";

/** Booking closes at this hour the evening before, unless the day says otherwise (common practice, no source). */
export const DEFAULT_CLOSE_TIME = "18:00";

/**
 * When booking closes if the council does not say: 18:00 the evening before, or — for a day
 * made after that (today, or tomorrow late in the evening) — when the last slot starts, so
 * households can still book the slots to come. A day with no slots yet closes at its end.
 * Never earlier than `opens`; a day whose slots have all started gets the time it would have
 * had, and the caller refuses it.
 */
export function defaultBookingClose(date: string, tz: string, slots: SlotInput[], opens: string): string {
  const eveningBefore = zonedToUtc(addDays(date, -1), DEFAULT_CLOSE_TIME, tz).toISOString();
  if (Date.parse(eveningBefore) > Date.parse(opens)) return eveningBefore;
  const starts = slotInstants(date, tz, slots).map((s) => s.starts_at);
  return starts.length ? starts.reduce((a, b) => (b > a ? b : a)) : zonedToUtc(addDays(date, 1), "00:00", tz).toISOString();
}

/** Slot instants from the wall-clock times of the day's zone. */
export function slotInstants(date: string, tz: string, slots: SlotInput[]) {
  return slots.map((s) => ({ starts_at: zonedToUtc(date, s.start, tz).toISOString(), ends_at: zonedToUtc(date, s.end, tz).toISOString(), capacity: s.capacity }));
}

export function assertNotPast(date: string, tz: string, now: Date) {
  if (date < localDate(now, tz)) throw new ApiError("invalid_input", "That day is in the past.", { date: "Pick today or a later day." });
}

export async function createGiveaway(ctx: CouncilContext, input: CreateGiveawayInput, clock: () => Date = () => new Date()) {
  const now = clock();
  assertNotPast(input.date, input.time_zone, now);
  const opens = input.booking_opens_at ?? now.toISOString();
  const closes = input.booking_closes_at ?? defaultBookingClose(input.date, input.time_zone, input.slots, opens);
  if (Date.parse(closes) <= Date.parse(opens)) {
    if (!input.booking_closes_at) {
      throw new ApiError("invalid_input", "Every slot of this day has already started.", { slots: "Add a slot that starts later today, or choose a later day." });
    }
    throw new ApiError("invalid_input", "Booking must close after it opens.", { booking_closes_at: "Booking must close after it opens; choose a later closing time." });
  }
  const id = newId();
  const approx = approximatePoint({ owner: placeOwner({ organisation_id: ctx.organisationId }), lat: input.location.lat, lng: input.location.lng });
  return writeTransaction(db(), async (trx) => {
    await insertDay(
      {
        id,
        organisation_id: ctx.organisationId,
        created_by: ctx.userId,
        material_code: input.material,
        title: input.title,
        notes: input.notes,
        date: input.date,
        time_zone: input.time_zone,
        lat: input.location.lat,
        lng: input.location.lng,
        address: input.address,
        approx_lat: approx.lat,
        approx_lng: approx.lng,
        unit: input.unit,
        unit_size: input.unit === "bags" ? input.bag_m3 : null,
        household_cap: input.household_cap,
        booking_opens_at: new Date(opens).toISOString(),
        booking_closes_at: new Date(closes).toISOString(),
        cancel_cutoff_hours: input.cancel_cutoff_hours,
        deposit_cents: input.deposit_cents,
        currency: "eur",
      },
      trx,
    );
    await insertSlots(id, slotInstants(input.date, input.time_zone, input.slots), trx);
    const day = (await findDay(id, trx))!;
    const slots = await slotsOf([id], trx);
    await recordAudit({ actor_id: ctx.userId, action: "giveaway.create", subject_type: "giveaway_day", subject_id: id, after: { ...day, slots } }, trx);
    return staffDayView(day, slots, ctx.organisationName);
  });
}
