// The demand grid: how needs are counted where others can see them. The globe is cut into
// rows 0.01° of latitude high (about 1.1 km), and each row into equal columns, as many as
// keep a cell about as wide as it is high without going under 1 km². Everything that leaves
// an owner's hands is told in cells, never places: the council's demand map, the
// suggestion for a giveaway day, and the supplier's preview.
import { EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";

/** The smallest area a cell may have, km² (so no cell is small enough to single out a household). */
export const MIN_CELL_AREA_KM2 = 1;
/** Row height, degrees of latitude. */
export const CELL_DEG = 0.01;

const R_KM = EARTH_MEAN_RADIUS_M / 1000;
const RAD = Math.PI / 180;
const ROWS = Math.round(180 / CELL_DEG);

export interface Cell {
  id: string;
  south: number;
  north: number;
  west: number;
  east: number;
  centre: { lat: number; lng: number };
  /** Area on Turf's sphere, bounded by the two parallels and two meridians, km². */
  area_km2: number;
}

function rowOf(lat: number): number {
  return Math.min(ROWS - 1, Math.max(0, Math.floor((lat + 90) / CELL_DEG)));
}

function rowEdges(row: number): [number, number] {
  // Rounded so the edges of neighbouring rows are the same numbers.
  const south = Math.round((row * CELL_DEG - 90) * 1e9) / 1e9;
  const north = Math.round(((row + 1) * CELL_DEG - 90) * 1e9) / 1e9;
  return [south, north];
}

/** Columns in a row: about square cells, but never so many that one is under the minimum area. */
function columnsOf(row: number): number {
  const [south, north] = rowEdges(row);
  const rowArea = 2 * Math.PI * R_KM * R_KM * (Math.sin(north * RAD) - Math.sin(south * RAD));
  const square = (360 * Math.cos(((south + north) / 2) * RAD)) / CELL_DEG;
  return Math.max(1, Math.floor(Math.min(rowArea / MIN_CELL_AREA_KM2, square)));
}

function cellAt(row: number, col: number): Cell {
  const [south, north] = rowEdges(row);
  const cols = columnsOf(row);
  const width = 360 / cols;
  const west = -180 + col * width;
  const east = col === cols - 1 ? 180 : -180 + (col + 1) * width;
  const area_km2 = R_KM * R_KM * (east - west) * RAD * (Math.sin(north * RAD) - Math.sin(south * RAD));
  return { id: `${row}:${col}`, south, north, west, east, centre: { lat: (south + north) / 2, lng: (west + east) / 2 }, area_km2 };
}

/** The cell holding a point. */
export function cellOf(lat: number, lng: number): Cell {
  const row = rowOf(lat);
  const cols = columnsOf(row);
  const col = Math.min(cols - 1, Math.max(0, Math.floor(((lng + 180) / 360) * cols)));
  return cellAt(row, col);
}

/** A cell by its id ("row:col"), or null when the id is not one. */
export function cellById(id: string): Cell | null {
  const m = /^(\d+):(\d+)$/.exec(id);
  if (!m) return null;
  const row = Number(m[1]);
  const col = Number(m[2]);
  if (row >= ROWS || col >= columnsOf(row)) return null;
  return cellAt(row, col);
}
