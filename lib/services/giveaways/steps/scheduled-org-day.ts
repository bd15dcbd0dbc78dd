import "server-only";
import { findOrgDay } from "@/db/giveaways";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilStaff } from "@/lib/auth/council-access";

/**
 * A day of the council's own, found and held inside `trx` (a booking waits for the change, and
 * the change sees every booking made before it): another council's day is a 404, a cancelled one a 409.
 */
export async function scheduledOrgDay(staff: CouncilStaff, dayId: string, trx: Parameters<typeof findOrgDay>[2]) {
  const day = await findOrgDay(dayId, staff.organisationId, trx, { lock: true });
  if (!day) throw notFound("That giveaway day");
  if (day.status !== "scheduled") throw new ApiError("invalid_state", "That day has been cancelled and can no longer change.");
  return day;
}
