import "server-only";
import { resolveContext, type Context } from "@/lib/context";
import { alertNeedsFor } from "@/lib/services/needs/alert-needs";

/** Worker job: every listing whose check is due (posted, restocked, changed, or come into its dates). */
export async function alertDueListings(ctx: Context = {}): Promise<{ listings: number; alerted: number }> {
  const { db: q, clock, signal } = resolveContext(ctx);
  const now = clock();
  const ids: string[] = await q("listings").whereNotNull("needs_due_at").andWhere("needs_due_at", "<=", now.toISOString()).orderBy("needs_due_at").limit(50).pluck("id");
  let alerted = 0;
  for (const id of ids) {
    // A worker told to stop takes no new listing; the rest stay due for the next one.
    if (signal?.aborted) break;
    try {
      alerted += (await alertNeedsFor(id, { db: q, clock })).alerted;
    } catch (err) {
      console.error(`[needs] alerts for listing ${id} failed:`, (err as Error).message);
    }
  }
  return { listings: ids.length, alerted };
}
