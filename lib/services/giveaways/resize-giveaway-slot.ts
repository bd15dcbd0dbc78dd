import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { findSlot, resizeSlot } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { slotView, type SlotView } from "@/lib/giveaways/view";
import { scheduledOrgDay } from "@/lib/services/giveaways/update-giveaway";
import type { CouncilStaff } from "@/lib/auth/council-access";

export async function resizeGiveawaySlot(ctx: CouncilStaff, dayId: string, slotId: string, capacity: number): Promise<SlotView> {
  return writeTransaction(db(), async (trx) => {
    await scheduledOrgDay(ctx, dayId, trx);
    const before = await findSlot(slotId, dayId, trx);
    if (!before) throw notFound("That slot");
    if ((await resizeSlot(slotId, dayId, capacity, trx)) === 0) {
      throw new ApiError("invalid_input", "Some households have already booked this slot.", { capacity: `At least ${before.booked}: that many households have booked.` });
    }
    const after = (await findSlot(slotId, dayId, trx))!;
    await recordAudit({ actor_id: ctx.userId, action: "giveaway.slot_resize", subject_type: "giveaway_slot", subject_id: slotId, before, after }, trx);
    return slotView(after);
  });
}
