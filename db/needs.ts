import type { Knex } from "knex";
import type { MaterialCode } from "@/lib/calc/facts";
import { boundingBox } from "@/lib/geo/box";
import type { LatLng } from "@/lib/match/types";
import type { CountedReservation } from "@/lib/needs/coverage";
import { REACH_BANDS_KM } from "@/lib/needs/reach";
import { isPg, lockForUpdate, nearBox } from "./dialect";
import { db, type Db } from "./index";
import type { NeedRow, NeedStatus } from "./types";

export const NEED_COLUMNS = [
  "id",
  "owner_id",
  "bed_id",
  "material_code",
  "quantity",
  "unit",
  "radius_km",
  "reach_km",
  "lat",
  "lng",
  "needed_by",
  "alerts",
  "status",
  "closed_at",
  "created_at",
  "updated_at",
] as const;

export type NeedPatch = Partial<Pick<NeedRow, "quantity" | "unit" | "radius_km" | "reach_km" | "lat" | "lng" | "needed_by" | "alerts" | "status" | "closed_at">>;

const cols = (alias = "needs") => NEED_COLUMNS.map((c) => `${alias}.${c}`);

/** A place and a distance around it (km): the circle a query reads, through each engine's index. */
export interface Around {
  centre: LatLng;
  km: number;
}

/**
 * Needs whose place lies around `a`: a latitude/longitude box on both engines (SQLite's
 * B-tree needs_reach_box narrows by it), and on PostgreSQL the cube of the GiST index
 * needs_near as well. Callers measure the exact distance themselves.
 */
function placedAround(b: Knex.QueryBuilder, a: Around): Knex.QueryBuilder {
  const box = boundingBox(a.centre, a.km);
  return nearBox(b.whereBetween("lat", [box.minLat, box.maxLat]).whereBetween("lng", [box.minLng, box.maxLng]), a.centre, a.km * 1000, "lat", "lng");
}

export async function insertNeed(row: NeedRow, q: Db = db()): Promise<void> {
  await q("needs").insert(row);
}

/** A need its owner may see and change; anyone else's is simply not found. */
export async function findOwnNeed(id: string, ownerId: string, q: Db = db()): Promise<NeedRow | undefined> {
  const row = (await q("needs").first(cols()).where({ id, owner_id: ownerId })) as NeedRow | undefined;
  return row;
}

export async function listOwnNeeds(ownerId: string, opts: { openOnly?: boolean; bedId?: string } = {}, q: Db = db()): Promise<NeedRow[]> {
  const b = q("needs").select(cols()).where({ owner_id: ownerId });
  if (opts.openOnly) b.andWhere("status", "open");
  if (opts.bedId) b.andWhere("bed_id", opts.bedId);
  const rows = (await b.orderBy([{ column: "created_at", order: "desc" }, { column: "id", order: "desc" }])) as NeedRow[];
  return rows;
}

export async function updateOwnNeed(id: string, ownerId: string, patch: NeedPatch, now: string, q: Db = db()): Promise<number> {
  return q("needs").where({ id, owner_id: ownerId }).update({ ...patch, updated_at: now });
}

/** Moves the status only from one of `from`, so two changes at once cannot both apply. */
export async function moveNeedStatus(id: string, from: readonly NeedStatus[], to: NeedStatus, now: string, q: Db = db()): Promise<boolean> {
  const closed_at = to === "open" ? null : now;
  return (await q("needs").where({ id }).whereIn("status", [...from]).update({ status: to, closed_at, updated_at: now })) === 1;
}

/** Deletes a need and its alerts; reservations made for it forget it (see the migration). */
export async function deleteOwnNeed(id: string, ownerId: string, q: Db = db()): Promise<boolean> {
  const found = await q("needs").first("id").where({ id, owner_id: ownerId });
  if (!found) return false;
  await q("reservations").where({ need_id: id }).update({ need_id: null });
  await q("needs").where({ id }).delete();
  return true;
}

/** Open needs whose date has passed are closed as expired; returns how many. */
export async function expireNeeds(today: string, now: string, q: Db = db()): Promise<number> {
  return q("needs").where("status", "open").andWhere("needed_by", "<", today).update({ status: "expired", closed_at: now, updated_at: now });
}

/** What an alert needs to know about a need that might want a listing. */
export type ReachingNeed = Pick<NeedRow, "id" | "owner_id" | "bed_id" | "quantity" | "unit" | "radius_km" | "lat" | "lng" | "needed_by" | "alerts">;

/**
 * Open needs of `material` filed under `band` whose place lies within the band around
 * `centre`, dated `fromDay` or later, not `excludeOwner`'s: one range of the needs_reach_box
 * index (status, material_code, reach_km, lat, lng) on SQLite, which is told to use it; one
 * search of the GiST index needs_near on PostgreSQL.
 */
export async function openNeedsInBand(material: MaterialCode, band: number, centre: LatLng, fromDay: string, excludeOwner: string, q: Db = db()): Promise<ReachingNeed[]> {
  const b = q
    .from(isPg(q) ? "needs" : q.raw("needs INDEXED BY needs_reach_box"))
    .select("id", "owner_id", "bed_id", "quantity", "unit", "radius_km", "lat", "lng", "needed_by", "alerts")
    .where({ status: "open", material_code: material, reach_km: band })
    .andWhere("needed_by", ">=", fromDay)
    .andWhereNot("owner_id", excludeOwner);
  return (await placedAround(b, { centre, km: band })) as ReachingNeed[];
}

/** What the aggregates read of a need: no id, no bed, never returned as is (lib/needs/demand.ts). */
export interface DemandSourceRow {
  owner_id: string;
  material_code: MaterialCode;
  quantity: number;
  unit: NeedRow["unit"];
  radius_km: number;
  needed_by: string;
  lat: number;
  lng: number;
}

/** Open needs (of `materials`, or all) dated `fromDay` or later whose place lies around `a`, through the same indexes. */
export async function openNeedsInBox(a: Around, fromDay: string, materials: readonly MaterialCode[] | null, q: Db = db()): Promise<DemandSourceRow[]> {
  const b = q("needs")
    .select("owner_id", "material_code", "quantity", "unit", "radius_km", "needed_by", "lat", "lng")
    .where("status", "open")
    .whereIn("reach_km", [...REACH_BANDS_KM])
    .andWhere("needed_by", ">=", fromDay);
  if (materials) b.whereIn("material_code", [...materials]);
  return (await placedAround(b, a)) as DemandSourceRow[];
}

/** The open needs a reservation might count towards: the one it names, or its bed's of the listing's material. */
export async function needsLinkedTo(r: { need_id: string | null; bed_id: string | null; gardener_id: string }, material: MaterialCode, q: Db = db()): Promise<NeedRow[]> {
  if (!r.need_id && !r.bed_id) return [];
  const b = q("needs").select(cols()).where("owner_id", r.gardener_id);
  b.andWhere((w) => {
    if (r.need_id) w.orWhere("id", r.need_id);
    if (r.bed_id) w.orWhere((x) => x.where({ bed_id: r.bed_id, material_code: material }));
  });
  // Locked on PostgreSQL: two reservations settling the same need at once decide one after the other.
  return (await lockForUpdate(b)) as NeedRow[];
}

/** Reservations (held, confirmed or collected) that may count towards these needs. */
export async function reservationsCounting(needs: readonly Pick<NeedRow, "id" | "bed_id" | "owner_id">[], q: Db = db()): Promise<CountedReservation[]> {
  if (!needs.length) return [];
  const ids = needs.map((n) => n.id);
  const beds = [...new Set(needs.map((n) => n.bed_id).filter((b): b is string => !!b))];
  const owners = [...new Set(needs.map((n) => n.owner_id))];
  const rows = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .select("r.need_id", "r.bed_id", "r.status", "r.quantity", "r.created_at", "l.material_code", "l.unit", "l.unit_size", "l.unit_mass_kg")
    .whereIn("r.status", ["held", "confirmed", "collected"])
    .whereIn("r.gardener_id", owners)
    .andWhere((w) => {
      w.whereIn("r.need_id", ids);
      if (beds.length) w.orWhere((x) => x.whereNull("r.need_id").whereIn("r.bed_id", beds));
    });
  return rows as CountedReservation[];
}
