import "server-only";
import { lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { updateWormQuality, wormListingsOf } from "@/db/grower-shipping";
import { recordAudit } from "@/db/audit";
import { notFound } from "@/lib/api/errors";
import type { CultureInput } from "@/lib/validation/grower";
import { resolveContext, type Context } from "@/lib/context";

export async function saveCulture(userId: string, listingId: string, input: CultureInput, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    await lockRows(trx, "listings", { id: listingId, owner_id: userId }); // merged into its quality JSON below
    const listing = (await wormListingsOf(userId, trx)).find((l) => l.id === listingId);
    if (!listing) throw notFound("That worm listing");
    const before = listing.quality;
    const after = { ...before, species: input.species, ships: input.ships, pickup: input.pickup };
    await updateWormQuality(listingId, userId, after, trx);
    await recordAudit({ actor_id: userId, action: "grower.culture", subject_type: "listing", subject_id: listingId, before, after }, trx);
    return { id: listingId, ...input };
  });
}
