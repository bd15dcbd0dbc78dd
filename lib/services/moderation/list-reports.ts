import { reportQueue, type QueueRow } from "@/db/reports";
import { resolveContext, type Context } from "@/lib/context";

export type { QueueRow };

/** The moderators' queue of reports: open, closed or all. */
export async function listReports(status: "open" | "closed" | "all", ctx: Context = {}): Promise<QueueRow[]> {
  const { db: q } = resolveContext(ctx);
  return reportQueue(status, q);
}
