import { reportQueue, type QueueRow } from "@/db/reports";

export type { QueueRow };

/** The moderators' queue of reports: open, closed or all. */
export async function listReports(status: "open" | "closed" | "all"): Promise<QueueRow[]> {
  return reportQueue(status);
}
