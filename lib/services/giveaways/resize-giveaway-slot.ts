import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findSlot, resizeSlot } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { slotView, type SlotView } from "@/lib/giveaways/view";
import { scheduledOrgDay } from "@/lib/services/giveaways/steps/scheduled-org-day";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

export async function resizeGiveawaySlot(staff: CouncilStaff, dayId: string, slotId: string, capacity: number, ctx: Context = {}): Promise<SlotView> {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    await scheduledOrgDay(staff, dayId, trx);
    const before = await findSlot(slotId, dayId, trx);
    if (!before) throw notFound("That slot");
    if ((await resizeSlot(slotId, dayId, capacity, trx)) === 0) {
      throw new ApiError("invalid_input", "Some households have already booked this slot.", { capacity: `At least ${before.booked}: that many households have booked.` });
    }
    const after = (await findSlot(slotId, dayId, trx))!;
    await recordAudit({ actor_id: staff.userId, action: "giveaway.slot_resize", subject_type: "giveaway_slot", subject_id: slotId, before, after }, trx);
    return slotView(after);
  });
}
