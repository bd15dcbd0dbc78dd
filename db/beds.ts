import { db, newId, nowIso, type Db } from "./index";

export interface BedRow {
  id: string;
  owner_id: string;
  name: string;
  shape: string;
  area_m2: number;
  lat: number | null;
  lng: number | null;
  recipe: string;
  start_date: string | null;
  created_at: string;
  updated_at: string;
}

const COLUMNS = ["id", "owner_id", "name", "shape", "area_m2", "lat", "lng", "recipe", "start_date", "created_at", "updated_at"];

export type BedWrite = Pick<BedRow, "name" | "shape" | "area_m2" | "lat" | "lng" | "recipe" | "start_date">;

/** Someone else's bed is simply not found. */
export async function findBed(id: string, ownerId: string, q: Db = db()): Promise<BedRow | undefined> {
  return (await q("beds").first(COLUMNS).where({ id, owner_id: ownerId })) as BedRow | undefined;
}

export async function listBeds(ownerId: string, q: Db = db()): Promise<BedRow[]> {
  return q("beds").select(COLUMNS).where({ owner_id: ownerId }).orderBy("created_at", "desc");
}

export async function insertBed(ownerId: string, row: BedWrite, q: Db = db()): Promise<string> {
  const id = newId();
  const now = nowIso();
  await q("beds").insert({ id, owner_id: ownerId, ...row, created_at: now, updated_at: now });
  return id;
}

export async function updateBed(id: string, ownerId: string, patch: Partial<BedWrite>, q: Db = db()): Promise<number> {
  return q("beds").where({ id, owner_id: ownerId }).update({ ...patch, updated_at: nowIso() });
}

export async function deleteBed(id: string, ownerId: string, q: Db = db()): Promise<number> {
  return q("beds").where({ id, owner_id: ownerId }).delete();
}

/** Beds with a start date whose owners take reminders, for the reminder job. */
export async function bedsForReminders(q: Db = db()) {
  return q("beds as b")
    .join("users as u", "u.id", "b.owner_id")
    .select("b.id", "b.name", "b.shape", "b.recipe", "b.lat", "b.lng", "b.start_date", "u.email", "u.display_name", "u.unit_system")
    .whereNotNull("b.start_date")
    .andWhere("u.reminders_opt_out", false)
    .whereNull("u.suspended_at");
}

/** What is already reserved towards each bed (held, confirmed or collected), with the listing's unit shape. */
export async function reservedForBeds(bedIds: string[], q: Db = db()) {
  if (bedIds.length === 0) return [];
  return (await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .select("r.bed_id", "r.quantity", "l.material_code as material", "l.unit", "l.unit_size", "l.unit_mass_kg")
    .whereIn("r.bed_id", bedIds)
    .whereIn("r.status", ["held", "confirmed", "collected"])) as {
    bed_id: string;
    quantity: number;
    material: string;
    unit: string;
    unit_size: number | null;
    unit_mass_kg: number | null;
  }[];
}

/** How many beds have been planned on Duffbank and the ground they cover, for the home page. */
export async function bedTotals(q: Db = db()): Promise<{ beds: number; area_m2: number }> {
  const row = (await q("beds").count({ n: "*" }).sum({ area: "area_m2" }).first()) as { n: number | string; area: number | string | null } | undefined;
  return { beds: Number(row?.n ?? 0), area_m2: Number(row?.area ?? 0) };
}
