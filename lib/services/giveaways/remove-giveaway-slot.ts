import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { deleteEmptySlot, findSlot } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { scheduledOrgDay } from "@/lib/services/giveaways/update-giveaway";
import type { CouncilStaff } from "@/lib/auth/council-access";

export async function removeGiveawaySlot(ctx: CouncilStaff, dayId: string, slotId: string): Promise<void> {
  await writeTransaction(db(), async (trx) => {
    await scheduledOrgDay(ctx, dayId, trx);
    const before = await findSlot(slotId, dayId, trx);
    if (!before) throw notFound("That slot");
    if ((await deleteEmptySlot(slotId, dayId, trx)) === 0) {
      throw new ApiError("invalid_state", "Households have booked this slot; make it smaller or cancel the day instead.");
    }
    await recordAudit({ actor_id: ctx.userId, action: "giveaway.slot_remove", subject_type: "giveaway_slot", subject_id: slotId, before }, trx);
  });
}
