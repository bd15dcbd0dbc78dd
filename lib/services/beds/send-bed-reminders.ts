import { bedsForReminders, type BedRow } from "@/db/beds";
import { enqueueEmail } from "@/db/outbox";
import { appUrl } from "@/lib/env";
import type { TimelineEvent } from "@/lib/calc/timeline";
import { bedEstimate, toBedView, type BedView } from "@/lib/beds/view";
import { resolveContext, type Context } from "@/lib/context";

/**
 * A step is mailed on its day, or within this many days after if the worker was down.
 * Older steps are not mailed at all, so saving a bed with a past start date does not
 * bring a pile of stale reminders.
 */
export const REMINDER_GRACE_DAYS = 3;

const dayMs = 86_400_000;

/** Puts each due timeline step of every bed in the outbox once (the dedupe key makes repeats harmless). */
export async function sendBedReminders(ctx: Context = {}): Promise<number> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const today = now.toISOString().slice(0, 10);
  const earliest = new Date(now.getTime() - REMINDER_GRACE_DAYS * dayMs).toISOString().slice(0, 10);
  let queued = 0;
  for (const row of await bedsForReminders(q)) {
    let bed: BedView;
    let timeline: TimelineEvent[];
    try {
      bed = toBedView(row as unknown as BedRow);
      timeline = bedEstimate(bed, now, row.unit_system === "imperial" ? "imperial" : "metric").timeline;
    } catch (err) {
      // One bed that cannot be estimated (a row saved before a check existed, say) must not
      // hold up everyone else's reminders; it is logged to be looked at and skipped.
      console.error(`[bed-reminders] skipped bed ${row.id}:`, err instanceof Error ? err.message : err);
      continue;
    }
    for (const step of timeline) {
      if (step.date > today || step.date < earliest) continue;
      const data = { name: row.display_name, bedName: bed.name, title: step.title, detail: step.detail, date: step.date, url: `${appUrl()}/beds/${bed.id}` };
      await enqueueEmail({ to: row.email, template: "bed_reminder", data, dedupe_key: `bed-reminder:${bed.id}:${step.key}:${step.date}` }, q);
      queued++;
    }
  }
  return queued;
}
