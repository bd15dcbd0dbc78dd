// What others may learn about open needs: counts and sums by demand-grid cell (lib/needs/grid.ts),
// never a need, a place or a person. Pure, so the thresholds are tested without a database.
//
// - Councils see cells (at least 1 km²) with at least MIN_PEOPLE different people needing a
//   material; a cell with fewer is left out whole, with no count that would let it be
//   worked out by subtraction.
// - Suppliers see, for a point and a material, how many open needs within 5 / 10 / 25 km it
//   would serve, measured between cell centres (both ends coarse, so moving the point about
//   cannot trace anyone's circle), with counts rounded past ten and amounts only where at
//   least MIN_PEOPLE people add up to them.
// - The giveaway-day suggestion is built from the council's visible cells only.
import type { MaterialCode } from "@/lib/calc/facts";
import { convertNeed, NEED_UNITS } from "@/lib/match/units";
import { distanceKm } from "@/lib/match/geo";
import type { NeedUnit } from "@/lib/match/types";
import { addDays } from "@/lib/time/zoned";
import { cellOf, type Cell } from "./grid";

/** Fewest different people behind any figure shown to someone else (k-anonymity; a product choice). */
export const MIN_PEOPLE = 3;
/** The rings a supplier's preview counts in, km. */
export const PREVIEW_RINGS_KM = [5, 10, 25] as const;
/** Counts from this size up are rounded to the nearest ROUND_COUNTS_TO. */
export const EXACT_COUNT_BELOW = 10;
export const ROUND_COUNTS_TO = 5;

/** An open need as the aggregates read it; nothing here ever leaves this module as is. */
export interface DemandRow {
  owner_id: string;
  material: MaterialCode;
  quantity: number;
  unit: NeedUnit;
  radius_km: number;
  needed_by: string;
  lat: number;
  lng: number;
}

/** The unit a material's figures are added up in: the first a need may be given in. */
export const baseUnit = (m: MaterialCode): NeedUnit => NEED_UNITS[m][0];
const inBase = (r: DemandRow) => convertNeed(r.material, r.quantity, r.unit, baseUnit(r.material));

/** Two significant figures: as precise as a sum of rough estimates deserves, and no more. */
export function roundSig(x: number, digits = 2): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  const p = Math.ceil(Math.log10(Math.abs(x)));
  const f = 10 ** (digits - p);
  return Math.round(x * f) / f;
}

/** A count as shown to others: exact while small, to the nearest five from ten up. */
export function roundCount(n: number): number {
  return n < EXACT_COUNT_BELOW ? n : Math.round(n / ROUND_COUNTS_TO) * ROUND_COUNTS_TO;
}

// ---------------------------------------------------------------------------------------
// Councils: cells.

export interface DemandCell {
  cell: Cell;
  material: MaterialCode;
  people: number;
  needs: number;
  /** Sum in `unit`, two significant figures. */
  quantity: number;
  unit: NeedUnit;
}

interface Group {
  cell: Cell;
  rows: DemandRow[];
  owners: Set<string>;
}

function groupByCell(rows: DemandRow[]): Group[] {
  const groups = new Map<string, Group>();
  for (const r of rows) {
    const cell = cellOf(r.lat, r.lng);
    let g = groups.get(cell.id);
    if (!g) groups.set(cell.id, (g = { cell, rows: [], owners: new Set() }));
    g.rows.push(r);
    g.owners.add(r.owner_id);
  }
  return [...groups.values()];
}

/** The cells of one material with at least MIN_PEOPLE people in them; the rest are left out. */
export function demandCells(rows: DemandRow[], material: MaterialCode): DemandCell[] {
  return visibleGroups(rows, material)
    .map((g) => ({
      cell: g.cell,
      material,
      people: g.owners.size,
      needs: g.rows.length,
      quantity: roundSig(g.rows.reduce((s, r) => s + inBase(r), 0)),
      unit: baseUnit(material),
    }))
    .sort((a, b) => b.people - a.people || a.cell.id.localeCompare(b.cell.id));
}

function visibleGroups(rows: DemandRow[], material: MaterialCode): Group[] {
  return groupByCell(rows.filter((r) => r.material === material)).filter((g) => g.owners.size >= MIN_PEOPLE);
}

/** Per material, what the visible cells add up to: how many cells, and how many different people in them. */
export function demandSummary(rows: DemandRow[], materials: readonly MaterialCode[]): { material: MaterialCode; cells: number; people: number }[] {
  return materials.map((material) => {
    const groups = visibleGroups(rows, material);
    const people = new Set(groups.flatMap((g) => [...g.owners]));
    return { material, cells: groups.length, people: people.size };
  });
}

// ---------------------------------------------------------------------------------------
// Suppliers: rings around a point.

export interface DemandRing {
  radius_km: number;
  /** Open needs this listing would serve within the ring (rounded from ten up). */
  needs: number;
  /** How many different people those are (rounded the same way). */
  people: number;
  /** Their sum in `unit`, two significant figures; null when fewer than MIN_PEOPLE people make it up. */
  quantity: number | null;
  unit: NeedUnit;
}

/**
 * The needs a listing of `material` at `point` would serve: within each ring of the point
 * and within the need's own radius, both measured between cell centres. The asker's own
 * needs are not counted.
 */
export function demandRings(rows: DemandRow[], point: { lat: number; lng: number }, material: MaterialCode, askerId: string | null): DemandRing[] {
  const from = cellOf(point.lat, point.lng).centre;
  const measured = rows
    .filter((r) => r.material === material && r.owner_id !== askerId)
    .map((r) => ({ r, km: distanceKm(from, cellOf(r.lat, r.lng).centre) }))
    .filter((x) => x.km <= x.r.radius_km);
  return PREVIEW_RINGS_KM.map((radius_km) => {
    const inside = measured.filter((x) => x.km <= radius_km).map((x) => x.r);
    const people = new Set(inside.map((r) => r.owner_id)).size;
    return {
      radius_km,
      needs: roundCount(inside.length),
      people: roundCount(people),
      quantity: people >= MIN_PEOPLE ? roundSig(inside.reduce((s, r) => s + inBase(r), 0)) : null,
      unit: baseUnit(material),
    };
  });
}

/** The widest ring the preview looks in, plus the widest radius a need can have: what to read. */
export const PREVIEW_READ_KM = PREVIEW_RINGS_KM[PREVIEW_RINGS_KM.length - 1];

// ---------------------------------------------------------------------------------------
// Councils: where and when a giveaway day would do most.

/** Materials a council gives away on its days (lib/validation/giveaways.ts). */
export const SUGGESTED_MATERIALS = ["leaves", "wood_chips", "compost"] as const satisfies readonly MaterialCode[];
/** Cells within this distance of the busiest one are served by the same day, km (a short drive; a product choice). */
export const CATCHMENT_KM = 3;
/** Households one time slot takes: the demo's hour-long slots hold eight to ten (common practice, no source). */
export const SLOT_HOUSEHOLDS = 10;
/** Days' notice a council needs to organise a day and let people book (a product choice). */
export const LEAD_DAYS = 14;
/** The day is set as late as still serves this share of the households, so it lands near when they need it. */
export const SERVED_SHARE = 0.75;

export interface GiveawaySuggestion {
  material: MaterialCode;
  /** The people-weighted middle of the cells served: a place in the grid, nobody's home. */
  place: { lat: number; lng: number };
  catchment_km: number;
  /** A Saturday, YYYY-MM-DD. */
  date: string;
  /** Households with an open need there that is still open on that day. */
  households: number;
  slots: number;
  slot_households: number;
  /** What those households need in all, in `unit`, two significant figures. */
  quantity: number;
  unit: NeedUnit;
}

function nextSaturdayFrom(day: string): string {
  const d = new Date(`${day}T12:00:00Z`);
  return addDays(day, (6 - d.getUTCDay() + 7) % 7);
}

/**
 * Where (the busiest visible cell and its neighbours within CATCHMENT_KM), when (the latest
 * Saturday, at least LEAD_DAYS ahead, that still comes before SERVED_SHARE of those
 * households' dates) and how many slots a giveaway day of `material` would fill; null when
 * no day would serve at least MIN_PEOPLE households.
 */
export function suggestGiveaway(rows: DemandRow[], material: MaterialCode, today: string): GiveawaySuggestion | null {
  const groups = visibleGroups(rows, material).sort((a, b) => b.owners.size - a.owners.size || a.cell.id.localeCompare(b.cell.id));
  if (!groups.length) return null;
  const busiest = groups[0].cell.centre;
  const served = groups.filter((g) => distanceKm(busiest, g.cell.centre) <= CATCHMENT_KM);

  // Each household once, with the last day any of its needs there runs to and what it needs in all.
  const households = new Map<string, { until: string; quantity: number }>();
  for (const g of served) {
    for (const r of g.rows) {
      const h = households.get(r.owner_id) ?? { until: r.needed_by, quantity: 0 };
      h.until = r.needed_by > h.until ? r.needed_by : h.until;
      h.quantity += inBase(r);
      households.set(r.owner_id, h);
    }
  }
  const earliest = nextSaturdayFrom(addDays(today, LEAD_DAYS));
  const open = [...households.values()].filter((h) => h.until >= earliest).sort((a, b) => (a.until < b.until ? -1 : a.until > b.until ? 1 : 0));
  if (open.length < MIN_PEOPLE) return null;
  // The household at the (1 − share) quantile sets the latest day that still serves the share.
  const pivot = open[Math.floor((1 - SERVED_SHARE) * (open.length - 1))].until;
  let date = earliest;
  while (addDays(date, 7) <= pivot) date = addDays(date, 7);
  const coming = open.filter((h) => h.until >= date);
  if (coming.length < MIN_PEOPLE) return null;

  const weight = served.reduce((s, g) => s + g.owners.size, 0);
  const place = {
    lat: served.reduce((s, g) => s + g.cell.centre.lat * g.owners.size, 0) / weight,
    lng: served.reduce((s, g) => s + g.cell.centre.lng * g.owners.size, 0) / weight,
  };
  return {
    material,
    place: { lat: Math.round(place.lat * 1e4) / 1e4, lng: Math.round(place.lng * 1e4) / 1e4 },
    catchment_km: CATCHMENT_KM,
    date,
    households: coming.length,
    slots: Math.ceil(coming.length / SLOT_HOUSEHOLDS),
    slot_households: SLOT_HOUSEHOLDS,
    quantity: roundSig(coming.reduce((s, h) => s + h.quantity, 0)),
    unit: baseUnit(material),
  };
}
