// The demo gazetteer: the places, streets and postcodes of Fernhollow and its villages, each
// with a point, so people find a place by name instead of typing coordinates. Every name and
// postcode here is invented (the FH postcode area does not exist), and the points sit on the
// shipped base map (seeds/basemap.ts draws the same town, villages, roads, woods and parks).
import { TOWN } from "./town";
import { seedId } from "./ids";

export type PlaceKind = "town" | "village" | "postcode" | "street" | "landmark";

export interface GazetteerEntry {
  id: string;
  kind: PlaceKind;
  name: string;
  /** The town or village it belongs to, for telling places apart ("Mill Leat Lane, Fernhollow"). */
  context: string | null;
  lat: number;
  lng: number;
}

const KM_LAT = 1 / 111.2;
const KM_LNG = 1 / (111.2 * Math.cos((TOWN.centre.lat * Math.PI) / 180));
/** A point `x` km east and `y` km north of the town centre: the base map's own grid. */
const at = (x: number, y: number) => ({ lat: Math.round((TOWN.centre.lat + y * KM_LAT) * 1e6) / 1e6, lng: Math.round((TOWN.centre.lng + x * KM_LNG) * 1e6) / 1e6 });

type Row = [kind: PlaceKind, name: string, context: string | null, x: number, y: number];

const ROWS: Row[] = [
  ["town", "Fernhollow", null, 0, 0.3],
  ["village", "Little Sedge", null, -4.8, 3.4],
  ["village", "Hartwell", null, 4.6, -3.7],
  ["village", "Oakhurst Green", null, 3.8, 4.6],
  ["landmark", "Brackenholt Wood", null, -5.5, -4.5],
  ["landmark", "Stonegrave Copse", null, 6.2, 1.5],
  ["landmark", "Lantern Hill Park", "Fernhollow", -0.9, 0.8],
  ["landmark", "Mill Meadows", "Fernhollow", 1.2, -1.1],
  ["landmark", "Fernhollow Market Square", "Fernhollow", 0.05, 0.1],
  ["street", "Hollin Road", "Fernhollow", -1.4, 0.15],
  ["street", "Marsh Lane", "Fernhollow", 0.4, -2.0],
  ["street", "Cobble Row", "Fernhollow", -0.5, 1.9],
  ["street", "Saltbox Street", "Fernhollow", -1.6, 1.0],
  ["street", "Bellfounder Road", "Fernhollow", 2.2, -1.8],
  ["street", "Tanner's Walk", "Fernhollow", -0.5, -0.6],
  ["street", "Orchard Rise", "Fernhollow", -0.4, 1.45],
  ["street", "Mill Leat Lane", "Fernhollow", 0.4, -1.6],
  ["street", "Heron Quay", "Fernhollow", 1.3, -1.45],
  ["street", "Wicker Close", "Fernhollow", 0.9, 0.9],
  ["street", "Juniper Steps", "Fernhollow", -0.7, 0.45],
  ["street", "Greyfriars Yard", "Fernhollow", 0.25, 0.4],
  ["street", "Thistle Crescent", "Fernhollow", 1.6, 1.75],
  ["street", "Lantern Hill", "Fernhollow", -1.0, 1.05],
  ["street", "Reedbed Lane", "Little Sedge", -4.6, 3.2],
  ["street", "Sedge Green", "Little Sedge", -4.95, 3.5],
  ["street", "Barley Close", "Hartwell", 4.45, -3.85],
  ["street", "Kiln Row", "Hartwell", 4.8, -3.95],
  ["street", "Acorn Way", "Oakhurst Green", 3.65, 4.45],
  ["street", "Green End", "Oakhurst Green", 3.95, 4.3],
  ["postcode", "FH1 2BT", "Fernhollow", 0.1, 0.25],
  ["postcode", "FH1 4QW", "Fernhollow", -0.6, -0.5],
  ["postcode", "FH1 6LR", "Fernhollow", 0.9, 0.8],
  ["postcode", "FH2 3NE", "Fernhollow", -0.4, 1.5],
  ["postcode", "FH2 7SA", "Fernhollow", -1.5, 1.0],
  ["postcode", "FH3 1MD", "Fernhollow", 0.4, -1.7],
  ["postcode", "FH3 5HQ", "Fernhollow", 2.1, -1.9],
  ["postcode", "FH7 4LS", "Little Sedge", -4.7, 3.3],
  ["postcode", "FH8 3HW", "Hartwell", 4.6, -3.9],
  ["postcode", "FH9 2GN", "Oakhurst Green", 3.8, 4.4],
];

export function gazetteerEntries(): GazetteerEntry[] {
  return ROWS.map(([kind, name, context, x, y]) => ({ id: seedId(`place:${kind}:${name}`), kind, name, context, ...at(x, y) }));
}
