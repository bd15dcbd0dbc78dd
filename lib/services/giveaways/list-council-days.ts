import "server-only";
import { listOrgDays, slotsOf } from "@/db/giveaways";
import { staffDayView, type StaffDayView } from "@/lib/giveaways/view";
import type { CouncilStaff } from "@/lib/auth/council-access";

/** Every day of the council, newest first, with its slots and how full they are. */
export async function councilDays(ctx: CouncilStaff): Promise<StaffDayView[]> {
  const days = await listOrgDays(ctx.organisationId);
  const slots = await slotsOf(days.map((d) => d.id));
  return days.map((d) => staffDayView(d, slots, ctx.organisationName));
}
