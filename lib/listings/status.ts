// The listing life cycle: draft → active ↔ paused → archived, plus the two states the
// system sets on its own — gone (nothing left; a database trigger keeps it in step with the
// quantities) and expired (past its end date; the worker and every read apply it) — and
// hidden, which only moderators set. Pure, so the rules are tested without a database.
import type { ListingAction } from "@/lib/validation/listings";

export type ListingStatus = "draft" | "active" | "paused" | "archived" | "gone" | "expired" | "hidden";

export interface StatusContext {
  /** Quantity still available (total − held − collected). */
  left: number;
  held: number;
  /** The end date has passed. */
  ended: boolean;
}

export type StatusMove =
  | { ok: true; to: ListingStatus; unchanged?: boolean }
  | { ok: false; message: string };

const live = (c: StatusContext): ListingStatus => (c.left > 1e-9 ? "active" : "gone");

export function planStatusChange(current: ListingStatus, action: ListingAction, c: StatusContext): StatusMove {
  if (current === "hidden") return { ok: false, message: "A moderator has hidden this listing; it cannot be changed until they restore it." };
  if (current === "archived") {
    return action === "archive" ? { ok: true, to: "archived", unchanged: true } : { ok: false, message: "Archived listings stay archived. Post a new one instead." };
  }
  const ended = { ok: false as const, message: "Its end date has passed. Set a later “available until” date first." };
  switch (action) {
    case "publish":
      if (current === "active" || current === "gone") return { ok: true, to: current, unchanged: true };
      if (current !== "draft") return { ok: false, message: `Only a draft can be published; this one is ${current}.` };
      if (c.ended) return ended;
      return { ok: true, to: live(c) };
    case "pause":
      if (current === "paused") return { ok: true, to: "paused", unchanged: true };
      if (current !== "active" && current !== "gone") return { ok: false, message: `Only a listing on offer can be paused; this one is ${current}.` };
      return { ok: true, to: "paused" };
    case "resume":
      if (current === "active") return { ok: true, to: "active", unchanged: true };
      if (current !== "paused" && current !== "expired") return { ok: false, message: `Only a paused or expired listing can be resumed; this one is ${current}.` };
      if (c.ended) return ended;
      return { ok: true, to: live(c) };
    case "archive":
      // Someone is on their way to collect: archiving now would strand their reservation.
      if (c.held > 1e-9) return { ok: false, message: "Some of it is on hold for a gardener. Settle those reservations before archiving." };
      return { ok: true, to: "archived" };
  }
}

/** What a reader should see: a listing past its end date is expired even before the worker has run. */
export function effectiveStatus(status: ListingStatus, availableUntil: string | null, now: Date = new Date()): ListingStatus {
  if ((status === "active" || status === "paused") && availableUntil && Date.parse(availableUntil) <= now.getTime()) return "expired";
  return status;
}

/** Statuses anyone may look at; the others are the owner's business only. */
export const PUBLIC_STATUSES: readonly ListingStatus[] = ["active", "paused", "gone", "expired"];

/** Actions the owner's dashboard offers for a status. */
export function actionsFor(status: ListingStatus): ListingAction[] {
  switch (status) {
    case "draft":
      return ["publish", "archive"];
    case "active":
    case "gone":
      return ["pause", "archive"];
    case "paused":
    case "expired":
      return ["resume", "archive"];
    default:
      return [];
  }
}

export const quantityLeft = (l: { quantity_total: number; quantity_held: number; quantity_collected: number }) =>
  // Rounded to a millionth so 14 − 3.3 − 0.7 reads as 10, not 10.000000000000002.
  Math.max(0, Math.round((l.quantity_total - l.quantity_held - l.quantity_collected) * 1e6) / 1e6);

/**
 * Where today falls in a listing's dates: before `available_from` it can be seen but not yet
 * reserved; from `available_until` on it has ended. Reserving, the reserve page and the
 * listing page all ask this, so they agree.
 */
export function datesState(l: { available_from: string | null; available_until: string | null }, now: Date = new Date()): "open" | "not_yet" | "ended" {
  if (l.available_until && Date.parse(l.available_until) <= now.getTime()) return "ended";
  if (l.available_from && Date.parse(l.available_from) > now.getTime()) return "not_yet";
  return "open";
}
