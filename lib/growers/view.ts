import { PAUSE_REASON_LABELS, WEEKDAY_NAMES } from "@/lib/validation/grower";

// How a grower's posting days and pause read, for the grower's page, a buyer's listing and
// the culture-order e-mails. Pure: the row comes from db/grower-shipping.ts.

/** Early in the week, so a parcel of live worms does not sit in a depot over the weekend (common practice, no source). */
export const DEFAULT_SHIP_WEEKDAYS = [1, 2];

export interface ShippingView {
  ship_weekdays: number[];
  ship_days: string[];
  paused: boolean;
  pause_reason: "heat" | "frost" | "other" | null;
  pause_note: string | null;
  /** What a buyer reads on the grower's listings. */
  notice: string;
}

export function shippingView(row: { ship_weekdays: string; paused: boolean | 0 | 1; pause_reason: ShippingView["pause_reason"]; pause_note: string | null } | undefined): ShippingView {
  const days = row ? row.ship_weekdays.split(",").filter(Boolean).map(Number) : DEFAULT_SHIP_WEEKDAYS;
  const paused = !!row?.paused;
  const names = days.map((d) => WEEKDAY_NAMES[d]);
  const notice = paused
    ? `Posting is paused because of ${PAUSE_REASON_LABELS[row!.pause_reason ?? "other"]}: worms are live animals and suffer in hot or freezing parcels. Collection may still be possible.${row?.pause_note ? ` ${row.pause_note}` : ""}`
    : `Parcels go out on ${names.join(" and ")}${days.every((d) => d >= 1 && d <= 3) ? ", so they do not sit in a depot over the weekend" : ""}.`;
  return { ship_weekdays: days, ship_days: names, paused, pause_reason: paused ? (row!.pause_reason ?? "other") : null, pause_note: row?.pause_note ?? null, notice };
}
