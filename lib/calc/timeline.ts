import {
  BED_MONTHS,
  MOISTURE_CHECK_DAYS,
  TOP_UP_MIN_DAYS_AFTER_BUILD,
  TOP_UP_SEASONS,
  WORMS_AFTER_DAYS,
} from "./facts";

export type TimelineKey =
  | "build"
  | "moisture_check"
  | "add_worms"
  | "settling_check"
  | "check_6_months"
  | "ready"
  | "top_up";

export interface TimelineEvent {
  key: TimelineKey;
  /** YYYY-MM-DD, a calendar date with no time zone. */
  date: string;
  title: string;
  detail?: string;
}

// Dates are calendar days, not instants: all arithmetic is on UTC midnight so the result
// cannot shift by a day with the server's or the browser's time zone.
const DAY_MS = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function parseDate(s: string): number | null {
  const m = ISO_DATE.exec(s);
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = utc(y, mo, d);
  const back = new Date(t);
  // Date.UTC rolls 2023-02-30 over to March; a real date survives the round trip.
  return back.getUTCFullYear() === y && back.getUTCMonth() === mo - 1 && back.getUTCDate() === d ? t : null;
}

/** True for a real calendar date written YYYY-MM-DD (no 2023-02-29, no 2024-13-01). */
export function isCalendarDate(s: string): boolean {
  return typeof s === "string" && parseDate(s) !== null;
}

function utc(year: number, month: number, day: number): number {
  const d = new Date(0);
  // setUTCFullYear, unlike Date.UTC, does not map years 0–99 to 1900–1999.
  d.setUTCFullYear(year, month - 1, day);
  return d.getTime();
}

const format = (t: number) => new Date(t).toISOString().slice(0, 10);
const addDays = (t: number, days: number) => t + days * DAY_MS;

/** Same day of the month `months` later, or that month's last day when it is shorter (31 Jan + 1 → 28/29 Feb). */
function addMonths(t: number, months: number): number {
  const d = new Date(t);
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + months;
  const lastDay = new Date(utc(y, m + 2, 0)).getUTCDate();
  return utc(y, m + 1, Math.min(d.getUTCDate(), lastDay));
}

/**
 * Every month/day from `from` on, up to and including the first one on or after `ready`:
 * the season's top-ups through the bed's first year, and the first once it is planted.
 */
function occurrences(from: number, ready: number, month: number, day: number): number[] {
  const out: number[] = [];
  for (let y = new Date(from).getUTCFullYear(); ; y++) {
    const t = utc(y, month, day);
    if (t < from) continue;
    out.push(t);
    if (t >= ready) return out;
  }
}

/**
 * The bed's first year, from the day it is built, and its first seasonal top-ups after it is
 * ready, so a bed is fed in every season whatever month it was built in. Top-ups fall in the
 * seasons when each material is plentiful, which depends on the hemisphere: south for a
 * negative latitude, north otherwise (and when the latitude is unknown).
 */
export function timeline(start: string, latitude: number | null, opts: { worms: boolean }): TimelineEvent[] {
  const t0 = parseDate(start);
  if (t0 === null) throw new RangeError(`start must be a calendar date YYYY-MM-DD, got "${start}"`);
  const hemisphere = latitude !== null && latitude < 0 ? "south" : "north";
  const ready = addMonths(t0, BED_MONTHS.ready);
  const events: { t: number; e: Omit<TimelineEvent, "date"> }[] = [];
  const at = (t: number, e: Omit<TimelineEvent, "date">) => events.push({ t, e });

  at(t0, {
    key: "build",
    title: "Build day",
    detail: "Lay the cardboard with seams overlapped and soak it, then spread and wet each layer in turn.",
  });
  for (const day of MOISTURE_CHECK_DAYS) {
    at(addDays(t0, day), {
      key: "moisture_check",
      title: `Squeeze test, day ${day}`,
      detail:
        "Squeeze a handful from under the top layer. A few drops is right; dry and crumbly needs water; a steady drip means leave it uncovered to drain.",
    });
  }
  if (opts.worms) {
    at(addDays(t0, WORMS_AFTER_DAYS.default), {
      key: "add_worms",
      title: "Put the worms in",
      detail: `Any time from day ${WORMS_AFTER_DAYS.min} to day ${WORMS_AFTER_DAYS.max}, once the bed is cool and damp: tuck them under the top layer in a few spots.`,
    });
  }
  at(addMonths(t0, BED_MONTHS.settling), {
    key: "settling_check",
    title: "See how far it has sunk",
    detail: "The bed will have settled noticeably by now. Top it up if bare cardboard shows.",
  });
  at(addMonths(t0, BED_MONTHS.half_year), {
    key: "check_6_months",
    title: "Half-year look",
    detail: "Dig in a hand: the cardboard should be soft or gone in places and the lower layers darker.",
  });
  at(ready, {
    key: "ready",
    title: "Ready to plant",
    detail: "Most of what went in should now be dark, crumbly and alive with worms.",
  });

  const earliestTopUp = addDays(t0, TOP_UP_MIN_DAYS_AFTER_BUILD);
  const topUps = [
    { season: TOP_UP_SEASONS.leaves[hemisphere], title: "Top up with fallen leaves", what: "a fresh layer of leaves" },
    { season: TOP_UP_SEASONS.clippings[hemisphere], title: "Top up with grass clippings", what: "a thin layer of clippings, a few centimetres at most so they don't mat" },
  ];
  for (const { season, title, what } of topUps) {
    for (const t of occurrences(earliestTopUp, ready, season.month, season.day)) {
      at(t, { key: "top_up", title, detail: `Any time in ${season.months}: add ${what}.` });
    }
  }

  return events
    .map((x, i) => ({ ...x, i }))
    .sort((a, b) => a.t - b.t || a.i - b.i)
    .map(({ t, e }) => ({ ...e, date: format(t) }));
}
