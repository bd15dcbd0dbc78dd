import "server-only";
import { expireNeeds } from "@/db/needs";
import { resolveContext, type Context } from "@/lib/context";
import { dayOf } from "@/lib/services/needs/steps/day-of";

/** Worker job: open needs whose date has passed close as expired. */
export async function expireOpenNeeds(ctx: Context = {}): Promise<number> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  return expireNeeds(dayOf(now), now.toISOString(), q);
}
