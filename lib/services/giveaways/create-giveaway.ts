import "server-only";
import { newId } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { insertDay, insertSlots, slotsOf, findDay } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError } from "@/lib/api/errors";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import type { CreateGiveawayInput } from "@/lib/validation/giveaways";
import { staffDayView } from "@/lib/giveaways/view";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { defaultBookingClose , slotInstants , assertNotPast } from "@/lib/giveaways/slots";


export async function createGiveaway(staff: CouncilStaff, input: CreateGiveawayInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
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
  const approx = approximatePoint({ owner: placeOwner({ organisation_id: staff.organisationId }), lat: input.location.lat, lng: input.location.lng });
  return writeTransaction(q, async (trx) => {
    await insertDay(
      {
        id,
        organisation_id: staff.organisationId,
        created_by: staff.userId,
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
    await recordAudit({ actor_id: staff.userId, action: "giveaway.create", subject_type: "giveaway_day", subject_id: id, after: { ...day, slots } }, trx);
    return staffDayView(day, slots, staff.organisationName);
  });
}
