import "server-only";
import { listOwnNeeds } from "@/db/needs";
import type { NeedView } from "@/lib/needs/view";
import { resolveContext, type Context } from "@/lib/context";
import { needViews } from "@/lib/services/needs/steps/need-views";

/** GET /api/needs: my needs, newest first (open ones only, or one bed's, when asked). */
export async function listNeeds(userId: string, opts: { openOnly?: boolean; bedId?: string } = {}, ctx: Context = {}): Promise<NeedView[]> {
  const { db: q, clock } = resolveContext(ctx);
  return needViews(await listOwnNeeds(userId, opts, q), q, clock());
}
