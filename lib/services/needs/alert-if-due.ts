import "server-only";
import { resolveContext, type Context } from "@/lib/context";
import { alertNeedsFor } from "@/lib/services/needs/alert-needs";

/** After a service changed a listing: alert at once if the change made it due (the worker is the safety net). */
export async function alertIfDue(listingId: string, ctx: Context = {}): Promise<void> {
  const { db: q, clock } = resolveContext(ctx);
  const row = await q("listings").first("needs_due_at").where({ id: listingId });
  if (!row?.needs_due_at || new Date(row.needs_due_at).getTime() > clock().getTime()) return;
  try {
    await alertNeedsFor(listingId, { db: q, clock });
  } catch (err) {
    console.error(`[needs] alerts for listing ${listingId} left to the worker:`, (err as Error).message);
  }
}
