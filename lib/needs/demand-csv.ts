import { toCsv } from "@/lib/format/csv";
import type { MaterialCode } from "@/lib/calc/facts";
import type { DemandCell, GiveawaySuggestion } from "@/lib/needs/demand";

/** The same cells as CSV, for a spreadsheet or a GIS. */
export function councilDemandCsv(d: CouncilDemand): string {
  const header = ["cell_id", "material", "centre_lat", "centre_lng", "south", "west", "north", "east", "area_km2", "people", "open_needs", "total_quantity", "unit"];
  const round6 = (x: number) => Math.round(x * 1e6) / 1e6;
  return toCsv(
    header,
    d.cells.map((c) => [c.id, c.material, round6(c.centre.lat), round6(c.centre.lng), round6(c.south), round6(c.west), round6(c.north), round6(c.east), c.area_km2, c.people, c.needs, c.quantity, c.unit]),
  );
}

export interface CouncilDemand {
  centre: { lat: number; lng: number };
  radius_km: number;
  material: MaterialCode;
  min_people: number;
  cell_min_area_km2: number;
  cells: (Omit<DemandCell, "cell"> & { id: string; south: number; west: number; north: number; east: number; centre: { lat: number; lng: number }; area_km2: number })[];
  /** Per material, what its visible cells add up to (for choosing what to look at). */
  materials: { material: MaterialCode; cells: number; people: number }[];
  suggestion: GiveawaySuggestion | null;
}
