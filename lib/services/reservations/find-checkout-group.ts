import { resolveContext, type Context } from "@/lib/context";

/**
 * The reservation a returning Stripe checkout session paid for, if it is the gardener's, with
 * every reservation of its "Reserve all" group in the order they were made (just itself when
 * it has no group). Undefined for someone else's session or one we do not know.
 */
export async function findCheckoutGroup(sessionId: string, gardenerId: string, ctx: Context = {}): Promise<{ id: string; ids: string[] } | undefined> {
  const { db: q } = resolveContext(ctx);
  const row = await q("payments as p")
    .join("reservations as r", "r.id", "p.reservation_id")
    .first("r.id", "r.group_id")
    .where({ "p.provider_ref": sessionId, "r.gardener_id": gardenerId });
  if (!row) return undefined;
  const ids: string[] = row.group_id ? await q("reservations").where({ group_id: row.group_id }).orderBy("created_at").pluck("id") : [row.id];
  return { id: row.id, ids };
}
