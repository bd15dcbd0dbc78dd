import "server-only";
import type { Knex } from "knex";
import { openNeedsInBox } from "@/db/needs";
import { MATERIAL_CODES, type MaterialCode } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import { demandCells, demandSummary, MIN_PEOPLE, suggestGiveaway, SUGGESTED_MATERIALS } from "@/lib/needs/demand";
import { cellOf, MIN_CELL_AREA_KM2 } from "@/lib/needs/grid";
import { DEFAULT_CENTER } from "@/lib/geo/default-center";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { dayOf } from "@/lib/services/needs/steps/day-of";
import { toDemandRow } from "@/lib/services/needs/steps/to-demand-row";
import { CouncilDemand } from "@/lib/needs/demand-csv";

/** How far around the council's place the desk looks by default, km. */
export const COUNCIL_DEMAND_RADIUS_KM = 25;

/** Where the council's last giveaway day was, or the map's default, when the desk gives no point. */
async function councilCentre(ctx: CouncilStaff, q: Knex) {
  const day = await q("giveaway_days").first("lat", "lng").where({ organisation_id: ctx.organisationId }).orderBy("date", "desc");
  return day ? { lat: Number(day.lat), lng: Number(day.lng) } : DEFAULT_CENTER;
}

/**
 * GET /api/council/demand: open needs around the council's place, by demand-grid cell and
 * material, each cell only when at least MIN_PEOPLE people are behind it; and where and when
 * a giveaway day of leaves, chips or compost would serve the most of them.
 */
export async function councilDemand(
  council: CouncilStaff,
  query: { material: MaterialCode; lat?: number; lng?: number; radius_km?: number },
  ctx: Context = {},
): Promise<CouncilDemand> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const centre = query.lat !== undefined && query.lng !== undefined ? { lat: query.lat, lng: query.lng } : await councilCentre(council, q);
  const radius_km = query.radius_km ?? COUNCIL_DEMAND_RADIUS_KM;
  const rows = (await openNeedsInBox({ centre, km: radius_km }, dayOf(now), null, q))
    .map(toDemandRow)
    // Whole cells: a cell is in or out by its centre, so no cell is cut to fewer people by the edge.
    .filter((r) => distanceKm(centre, cellOf(r.lat, r.lng).centre) <= radius_km);
  const suggestable = (SUGGESTED_MATERIALS as readonly MaterialCode[]).includes(query.material);
  return {
    centre,
    radius_km,
    material: query.material,
    min_people: MIN_PEOPLE,
    cell_min_area_km2: MIN_CELL_AREA_KM2,
    cells: demandCells(rows, query.material).map(({ cell, ...figures }) => ({
      id: cell.id,
      south: cell.south,
      west: cell.west,
      north: cell.north,
      east: cell.east,
      centre: cell.centre,
      area_km2: Math.round(cell.area_km2 * 100) / 100,
      ...figures,
    })),
    materials: demandSummary(rows, MATERIAL_CODES),
    suggestion: suggestable ? suggestGiveaway(rows, query.material, dayOf(now)) : null,
  };
}
