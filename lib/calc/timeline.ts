import {
  BAG_M3,
  BED_MONTHS,
  MOISTURE_CHECK_DAYS,
  PLANT_INTO_MONTHS,
  SETTLED_SHARE,
  TOP_UP_DEPTH_CM,
  TOP_UP_MIN_DAYS_AFTER_BUILD,
  TOP_UP_SEASONS,
  WORMS_AFTER_DAYS,
} from "./facts";
import { ceilWhole, roundTo } from "./numbers";
import type { UnitSystem } from "./units";
import { formatQuantity } from "@/lib/format/quantity";

export type TimelineKey =
  | "build"
  | "moisture_check"
  | "add_worms"
  | "settling_check"
  | "check_6_months"
  | "plant_into"
  | "ready"
  | "top_up";

/** What a seasonal top-up takes for this bed. */
export interface TopUpAmount {
  material: "leaves" | "grass_clippings";
  depth_cm: number;
  m3: number;
  /** 30 US gal bags (common practice size). */
  bags: number;
}

export interface TimelineEvent {
  key: TimelineKey;
  /** YYYY-MM-DD, a calendar date with no time zone. */
  date: string;
  title: string;
  detail?: string;
  /** At the settling checks and the year's end: how deep the bed should be by then (common practice). */
  settled_depth_cm?: number;
  /** At a top-up: how much it takes for this bed. */
  top_up?: TopUpAmount;
}

/** The bed the timeline is for, when its amounts are wanted. */
export interface TimelineBed {
  area_m2: number;
  /** Leaves, straw and chips as built, cm. */
  built_depth_cm: number;
}

export interface TimelineOptions {
  worms: boolean;
  bed?: TimelineBed;
  /** The units the details are written in. */
  units?: UnitSystem;
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

/** The dates that say what a bed can be used for (see PLANT_INTO_MONTHS, BED_MONTHS). */
export interface BedMilestones {
  build: string;
  /** From here you can plant into it… */
  plant_into_from: string;
  /** …and by here at the latest (6–9 months is the usual advice). */
  plant_into_until: string;
  /** Most of the material has turned to soil. */
  soil_by: string;
}

export function bedMilestones(start: string): BedMilestones {
  const t0 = parseDate(start);
  if (t0 === null) throw new RangeError(`start must be a calendar date YYYY-MM-DD, got "${start}"`);
  return {
    build: format(t0),
    plant_into_from: format(addMonths(t0, PLANT_INTO_MONTHS.from)),
    plant_into_until: format(addMonths(t0, PLANT_INTO_MONTHS.until)),
    soil_by: format(addMonths(t0, BED_MONTHS.ready)),
  };
}

export type BedStage = "not_built" | "settling" | "plant_into" | "soil";

/** Which of the milestones applies on `today` (YYYY-MM-DD). */
export function bedStage(m: BedMilestones, today: string): BedStage {
  if (today < m.build) return "not_built";
  if (today < m.plant_into_from) return "settling";
  if (today < m.soil_by) return "plant_into";
  return "soil";
}

function topUpAmount(material: TopUpAmount["material"], area_m2: number): TopUpAmount {
  const depth_cm = TOP_UP_DEPTH_CM[material];
  const m3 = (area_m2 * depth_cm) / 100;
  return { material, depth_cm, m3: roundTo(m3, 3), bags: Math.max(1, ceilWhole(m3 / BAG_M3)) };
}

/**
 * The bed's first year, from the day it is built, and its first seasonal top-ups after it is
 * ready, so a bed is fed in every season whatever month it was built in. Top-ups fall in the
 * seasons when each material is plentiful, which depends on the hemisphere: south for a
 * negative latitude, north otherwise (and when the latitude is unknown). With the bed's area
 * and built depth, the settling checks say how deep it should be by then and each top-up
 * how much it takes, in the given units.
 */
export function timeline(start: string, latitude: number | null, opts: TimelineOptions): TimelineEvent[] {
  const t0 = parseDate(start);
  if (t0 === null) throw new RangeError(`start must be a calendar date YYYY-MM-DD, got "${start}"`);
  const units = opts.units ?? "metric";
  const q = (v: number, u: "cm" | "m3") => formatQuantity(v, u, units);
  const bed = opts.bed && opts.bed.area_m2 > 0 ? opts.bed : undefined;
  const built = bed && bed.built_depth_cm > 0 ? bed.built_depth_cm : null;
  const settled = (months: keyof typeof SETTLED_SHARE) => (built === null ? undefined : roundTo(built * SETTLED_SHARE[months], 1));
  const sunk = (months: keyof typeof SETTLED_SHARE) =>
    built === null ? "" : ` Expect about ${q(settled(months)!, "cm")} of the ${q(built, "cm")} you built (common practice).`;
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
    detail: `The bed will have settled noticeably by now.${sunk(3)} Top it up if bare cardboard shows.`,
    ...(built === null ? {} : { settled_depth_cm: settled(3) }),
  });
  at(addMonths(t0, BED_MONTHS.half_year), {
    key: "check_6_months",
    title: "Half-year look",
    detail: `Dig in a hand: the cardboard should be soft or gone in places and the lower layers darker.${sunk(6)}`,
    ...(built === null ? {} : { settled_depth_cm: settled(6) }),
  });
  at(addMonths(t0, PLANT_INTO_MONTHS.from), {
    key: "plant_into",
    title: "You can plant into it",
    detail: `Any time from now to about month ${PLANT_INTO_MONTHS.until}, ${PLANT_INTO_MONTHS.source}: push a trowel through to the soil, and set plants into pockets of compost where the layers are still coarse.`,
  });
  at(ready, {
    key: "ready",
    title: "Most of it has turned to soil",
    detail: `Most of what went in should now be dark, crumbly and alive with worms: sow and plant anywhere.${sunk(12)}`,
    ...(built === null ? {} : { settled_depth_cm: settled(12) }),
  });

  const earliestTopUp = addDays(t0, TOP_UP_MIN_DAYS_AFTER_BUILD);
  const topUps = [
    { season: TOP_UP_SEASONS.leaves[hemisphere], material: "leaves" as const, title: "Top up with fallen leaves", what: "a fresh layer of leaves" },
    {
      season: TOP_UP_SEASONS.clippings[hemisphere],
      material: "grass_clippings" as const,
      title: "Top up with grass clippings",
      what: "a thin layer of clippings, a few centimetres at most so they don't mat",
    },
  ];
  for (const { season, material, title, what } of topUps) {
    const amount = bed ? topUpAmount(material, bed.area_m2) : undefined;
    const how = amount
      ? `${q(amount.depth_cm, "cm")} of ${material === "leaves" ? "leaves" : "clippings, thin so they don't mat"}: ${q(amount.m3, "m3")}, about ${amount.bags} ${amount.bags === 1 ? "bag" : "bags"} for this bed`
      : what;
    for (const t of occurrences(earliestTopUp, ready, season.month, season.day)) {
      at(t, { key: "top_up", title, detail: `Any time in ${season.months}: add ${how}.`, ...(amount ? { top_up: amount } : {}) });
    }
  }

  return events
    .map((x, i) => ({ ...x, i }))
    .sort((a, b) => a.t - b.t || a.i - b.i)
    .map(({ t, e }) => ({ ...e, date: format(t) }));
}
