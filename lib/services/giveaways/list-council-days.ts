import "server-only";
import { listOrgDays, slotsOf } from "@/db/giveaways";
import { staffDayView, type StaffDayView } from "@/lib/giveaways/view";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

/** Every day of the council, newest first, with its slots and how full they are. */
export async function councilDays(staff: CouncilStaff, ctx: Context = {}): Promise<StaffDayView[]> {
  const { db: q } = resolveContext(ctx);
  const days = await listOrgDays(staff.organisationId, q);
  const slots = await slotsOf(days.map((d) => d.id), q);
  return days.map((d) => staffDayView(d, slots, staff.organisationName));
}
