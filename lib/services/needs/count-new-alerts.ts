import "server-only";
import { unseenAlerts } from "@/db/need-alerts";
import { resolveContext, type Context } from "@/lib/context";

/** How many notices on open needs I have not looked at (the count beside "My needs"). */
export async function countNewAlerts(userId: string, ctx: Context = {}): Promise<number> {
  return unseenAlerts(userId, resolveContext(ctx).db);
}
