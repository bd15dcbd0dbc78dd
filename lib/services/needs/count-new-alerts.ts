import "server-only";
import { unseenAlerts } from "@/db/need-alerts";
import { resolveContext, type NeedsContext } from "@/lib/services/needs/context";

/** How many notices on open needs I have not looked at (the count beside "My needs"). */
export async function countNewAlerts(userId: string, ctx: NeedsContext = {}): Promise<number> {
  return unseenAlerts(userId, resolveContext(ctx).q);
}
