import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { deleteEmptySlot, findSlot, insertSlots, resizeSlot, slotsOf } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import type { SlotInput } from "@/lib/validation/giveaways";
import { slotView, type SlotView } from "@/lib/giveaways/view";
import { slotInstants } from "@/lib/services/giveaways/create-giveaway";
import { scheduledOrgDay } from "@/lib/services/giveaways/update-giveaway";
import type { CouncilContext } from "@/lib/auth/council-access";

export async function addGiveawaySlots(ctx: CouncilContext, dayId: string, slots: SlotInput[]): Promise<SlotView[]> {
  return writeTransaction(db(), async (trx) => {
    const day = await scheduledOrgDay(ctx, dayId, trx);
    const ids = await insertSlots(dayId, slotInstants(day.date, day.time_zone, slots), trx);
    const added = (await slotsOf([dayId], trx)).filter((s) => ids.includes(s.id));
    await recordAudit({ actor_id: ctx.userId, action: "giveaway.slots_add", subject_type: "giveaway_day", subject_id: dayId, after: added }, trx);
    return added.map(slotView);
  });
}

export async function resizeGiveawaySlot(ctx: CouncilContext, dayId: string, slotId: string, capacity: number): Promise<SlotView> {
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

export async function removeGiveawaySlot(ctx: CouncilContext, dayId: string, slotId: string): Promise<void> {
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
