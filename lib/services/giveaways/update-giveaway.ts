import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findOrgDay, shiftSlots, slotsOf, updateOrgDay } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import type { GiveawayDayRow } from "@/db/types";
import { ApiError } from "@/lib/api/errors";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import { wallTime, zonedToUtc } from "@/lib/time/zoned";
import { giveawayQuantityIssue, type UpdateGiveawayInput } from "@/lib/validation/giveaways";
import { staffDayView } from "@/lib/giveaways/view";
import { assertNotPast } from "@/lib/giveaways/slots";
import { scheduledOrgDay } from "@/lib/services/giveaways/steps/scheduled-org-day";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

/** Once anyone has booked, these would change what they booked, so they stay as they are. */
const FIXED_ONCE_BOOKED = ["date", "time_zone", "material", "unit", "bag_m3"] as const;

export async function updateGiveaway(staff: CouncilStaff, dayId: string, input: UpdateGiveawayInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  return writeTransaction(q, async (trx) => {
    const before = await scheduledOrgDay(staff, dayId, trx);
    const slots = await slotsOf([dayId], trx);
    const booked = slots.reduce((n, s) => n + s.booked, 0);
    if (booked > 0) {
      const changed = FIXED_ONCE_BOOKED.filter((k) => input[k] !== undefined && input[k] !== currentValue(before, k));
      if (changed.length) {
        throw new ApiError("invalid_state", `${booked} household${booked === 1 ? " has" : "s have"} booked, so ${changed.join(", ")} can no longer change. Cancel the day and make a new one instead.`);
      }
    }
    const patch: Partial<GiveawayDayRow> = {};
    if (input.title !== undefined) patch.title = input.title;
    if (input.notes !== undefined) patch.notes = input.notes;
    if (input.material !== undefined) patch.material_code = input.material;
    if (input.unit !== undefined) patch.unit = input.unit;
    const unit = input.unit ?? before.unit;
    if (input.unit !== undefined || input.bag_m3 !== undefined) patch.unit_size = unit === "bags" ? (input.bag_m3 ?? before.unit_size) : null;
    if (input.household_cap !== undefined) patch.household_cap = input.household_cap;
    const capIssue = input.household_cap !== undefined || input.unit !== undefined ? giveawayQuantityIssue(input.household_cap ?? before.household_cap, unit) : null;
    if (capIssue) throw new ApiError("invalid_input", capIssue, { household_cap: capIssue });
    if (input.cancel_cutoff_hours !== undefined) patch.cancel_cutoff_hours = input.cancel_cutoff_hours;
    if (input.deposit_cents !== undefined) patch.deposit_cents = input.deposit_cents;
    if (input.address !== undefined) patch.address = input.address;
    if (input.location) {
      const approx = approximatePoint({ owner: placeOwner(before), lat: input.location.lat, lng: input.location.lng });
      Object.assign(patch, { lat: input.location.lat, lng: input.location.lng, approx_lat: approx.lat, approx_lng: approx.lng });
    }
    const date = input.date ?? before.date;
    const tz = input.time_zone ?? before.time_zone;
    if (date !== before.date || tz !== before.time_zone) {
      assertNotPast(date, tz, now);
      Object.assign(patch, { date, time_zone: tz });
      // Nobody has booked (checked above), so the slots keep their wall-clock times on the new day.
      for (const s of slots) {
        const shift = zonedToUtc(date, wallTime(s.starts_at, before.time_zone), tz).getTime() - Date.parse(s.starts_at);
        await shiftSlots(dayId, [s], shift, trx);
      }
    }
    const opens = input.booking_opens_at ? new Date(input.booking_opens_at).toISOString() : before.booking_opens_at;
    const closes = input.booking_closes_at ? new Date(input.booking_closes_at).toISOString() : before.booking_closes_at;
    if (Date.parse(closes) <= Date.parse(opens)) {
      throw new ApiError("invalid_input", "Booking must close after it opens.", { booking_closes_at: "Booking must close after it opens." });
    }
    Object.assign(patch, { booking_opens_at: opens, booking_closes_at: closes });
    await updateOrgDay(dayId, staff.organisationId, patch, trx);
    const after = (await findOrgDay(dayId, staff.organisationId, trx))!;
    const afterSlots = await slotsOf([dayId], trx);
    await recordAudit({ actor_id: staff.userId, action: "giveaway.update", subject_type: "giveaway_day", subject_id: dayId, before, after }, trx);
    return staffDayView(after, afterSlots, staff.organisationName);
  });
}

function currentValue(day: GiveawayDayRow, key: (typeof FIXED_ONCE_BOOKED)[number]) {
  if (key === "material") return day.material_code;
  if (key === "bag_m3") return day.unit_size;
  return day[key];
}
