// The pickup times a new reservation of a listing can choose from, as the reserve page and a
// plan's stops offer them: each window's next opening that leaves the supplier time to
// answer first (lib/reservations/policy.ts), with the time they would have to answer by.
// Pure, so the server works it out the same way for every page.
import { answerDeadline, earliestPickupStart, NO_WINDOW_PICKUP_DAYS } from "./policy";
import { nextOccurrence, windowLabel, type PickupWindow } from "./pickup-times";

export interface PickupChoice {
  id: string;
  label: string;
  next_start: string;
  next_end: string;
  /** When the supplier would have to answer by; null when the listing accepts at once. */
  answer_by: string | null;
}

export interface PickupTerms {
  /** A payment or deposit to make first. */
  owes: boolean;
  autoAccept: boolean;
}

/** When the supplier would have to answer a request made `now` for a pickup starting at `start` (none: the week to arrange one). */
export function answerByFor(now: Date, terms: PickupTerms, start: Date | null): string | null {
  if (terms.autoAccept) return null;
  return answerDeadline(now, start ?? new Date(now.getTime() + NO_WINDOW_PICKUP_DAYS * 86_400_000)).toISOString();
}

export function pickupChoices(windows: readonly (PickupWindow & { listing_id?: string })[], now: Date, terms: PickupTerms): PickupChoice[] {
  const notBefore = earliestPickupStart(now, terms);
  return windows
    .map((w) => ({ w, next: nextOccurrence(w, now, undefined, notBefore) }))
    .filter((x): x is { w: PickupWindow; next: { start: Date; end: Date } } => x.next !== null)
    .sort((a, b) => a.next.start.getTime() - b.next.start.getTime())
    .map(({ w, next }) => ({ id: w.id, label: windowLabel(w), next_start: next.start.toISOString(), next_end: next.end.toISOString(), answer_by: answerByFor(now, terms, next.start) }));
}
