import { createEvents, type EventAttributes } from "ics";
import type { TimelineEvent } from "@/lib/calc/timeline";
import { ApiError } from "@/lib/api/errors";

const dateParts = (d: string): [number, number, number] => {
  const [y, m, day] = d.split("-").map(Number);
  return [y, m, day];
};

function nextDay(d: string): [number, number, number] {
  const t = new Date(`${d}T00:00:00Z`);
  t.setUTCDate(t.getUTCDate() + 1);
  return [t.getUTCFullYear(), t.getUTCMonth() + 1, t.getUTCDate()];
}

/** The bed's timeline as an iCalendar file: one all-day event per step, stable UIDs. */
export function bedCalendar(bed: { id: string; name: string }, timeline: TimelineEvent[], appUrl: string): string {
  const events: EventAttributes[] = timeline.map((e, i) => ({
    uid: `${bed.id}-${e.key}-${e.date}-${i}@duffbank`,
    start: dateParts(e.date),
    end: nextDay(e.date),
    title: `${bed.name}: ${e.title}`,
    description: e.detail ?? e.title,
    url: `${appUrl}/beds/${bed.id}`,
    categories: ["Duffbank", "garden"],
    productId: "-//Duffbank//Bed timeline//EN",
    calName: `Duffbank: ${bed.name}`,
  }));
  const { error, value } = createEvents(events);
  if (error || !value) throw new ApiError("internal", "The calendar could not be made.");
  return value;
}
