import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { insertSlots, slotsOf } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import type { SlotInput } from "@/lib/validation/giveaways";
import { slotView, type SlotView } from "@/lib/giveaways/view";
import { slotInstants } from "@/lib/giveaways/slots";
import { scheduledOrgDay } from "@/lib/services/giveaways/steps/scheduled-org-day";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

export async function addGiveawaySlots(staff: CouncilStaff, dayId: string, slots: SlotInput[], ctx: Context = {}): Promise<SlotView[]> {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    const day = await scheduledOrgDay(staff, dayId, trx);
    const ids = await insertSlots(dayId, slotInstants(day.date, day.time_zone, slots), trx);
    const added = (await slotsOf([dayId], trx)).filter((s) => ids.includes(s.id));
    await recordAudit({ actor_id: staff.userId, action: "giveaway.slots_add", subject_type: "giveaway_day", subject_id: dayId, after: added }, trx);
    return added.map(slotView);
  });
}

