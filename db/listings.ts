import type { Knex } from "knex";
import { db, nowIso, type Db } from "./index";
import type { ListingQuality, ListingRow, ListingStatus } from "./types";
import { parseQuality } from "@/lib/listings/quality";
import type { MaterialCode } from "@/lib/calc/facts";
import { boundingBox } from "@/lib/geo/box";
import type { LatLng } from "@/lib/match/types";
import { nearBox } from "./dialect";

export const LISTING_COLUMNS = [
  "id",
  "owner_id",
  "organisation_id",
  "material_code",
  "title",
  "description",
  "status",
  "unit",
  "unit_size",
  "unit_mass_kg",
  "quantity_total",
  "quantity_held",
  "quantity_collected",
  "price_cents",
  "currency",
  "deposit_cents",
  "max_per_reservation",
  "pack_size",
  "pack_price_cents",
  "auto_accept",
  "lat",
  "lng",
  "address",
  "approx_lat",
  "approx_lng",
  "available_from",
  "available_until",
  "quality",
  "created_at",
  "updated_at",
] as const;

const cols = (alias = "listings") => LISTING_COLUMNS.map((c) => `${alias}.${c}`);

/** The columns a person may change through the form; the rest move only through services. */
export type ListingPatch = Partial<
  Pick<
    ListingRow,
    | "title"
    | "description"
    | "unit"
    | "unit_size"
    | "unit_mass_kg"
    | "price_cents"
    | "currency"
    | "deposit_cents"
    | "max_per_reservation"
    | "pack_size"
    | "pack_price_cents"
    | "auto_accept"
    | "lat"
    | "lng"
    | "address"
    | "approx_lat"
    | "approx_lng"
    | "available_from"
    | "available_until"
    | "quality"
  >
>;

/** Rows a person manages: their own, and their organisations'. Authorisation lives in the query. */
function managedBy(userId: string, q: Db) {
  return (b: Knex.QueryBuilder) =>
    b.where("listings.owner_id", userId).orWhereIn("listings.organisation_id", q("memberships").select("organisation_id").where("user_id", userId));
}

/**
 * A listings row as the code sees it: the quality declarations, stored as JSON text, parsed
 * here and nowhere else. Every repository that reads listing rows maps them through this.
 */
export function toListingRow<T extends { quality: ListingQuality }>(raw: unknown): T {
  const r = (raw ?? {}) as Record<string, unknown>;
  return { ...r, quality: parseQuality(typeof r.quality === "string" ? r.quality : null) } as unknown as T;
}

export async function insertListing(row: Omit<ListingRow, "created_at" | "updated_at">, q: Db = db()): Promise<void> {
  const now = nowIso();
  await q("listings").insert({ ...row, quality: JSON.stringify(row.quality), created_at: now, updated_at: now });
}

/** Any listing by id, whatever its status: callers decide what the asker may see. */
export async function findListing(id: string, q: Db = db()): Promise<ListingRow | undefined> {
  const row = await q("listings").first(cols()).where("listings.id", id);
  return row ? toListingRow<ListingRow>(row) : undefined;
}

/** The facts a need alert's page shows beside the offer, or undefined. */
export async function findListingFacts(id: string, q: Db = db()): Promise<Pick<ListingRow, "quality" | "unit_size" | "unit_mass_kg" | "max_per_reservation"> | undefined> {
  const row = await q("listings").first("quality", "unit_size", "unit_mass_kg", "max_per_reservation").where({ id });
  return row ? toListingRow<Pick<ListingRow, "quality" | "unit_size" | "unit_mass_kg" | "max_per_reservation">>(row) : undefined;
}

/** A listing's quality declarations alone ({} for none, or for no such listing). */
export async function listingQuality(id: string, q: Db = db()): Promise<ListingQuality> {
  return toListingRow<{ quality: ListingQuality }>(await q("listings").first("quality").where({ id })).quality;
}

/**
 * Active listings of `material` whose public point lies within `km` of `centre` (a box, and
 * the cube of listings_near on PostgreSQL; callers measure the exact distance), not
 * `excludeOwner`'s, at most `limit`.
 */
export async function activeListingsAround(material: MaterialCode, centre: LatLng, km: number, excludeOwner: string, limit: number, q: Db = db()): Promise<ListingRow[]> {
  const box = boundingBox(centre, km);
  const b = q("listings")
    .select(cols())
    .where({ "listings.status": "active", "listings.material_code": material })
    .whereBetween("listings.approx_lat", [box.minLat, box.maxLat])
    .whereBetween("listings.approx_lng", [box.minLng, box.maxLng])
    .andWhereNot("listings.owner_id", excludeOwner)
    .limit(limit);
  return ((await nearBox(b, centre, km * 1000, "listings.approx_lat", "listings.approx_lng")) as Record<string, unknown>[]).map((r) => toListingRow<ListingRow>(r));
}

/** A listing the person may manage, or undefined (which the caller answers as 404). */
export async function findManagedListing(id: string, userId: string, q: Db = db()): Promise<ListingRow | undefined> {
  const row = await q("listings").first(cols()).where("listings.id", id).andWhere(managedBy(userId, q));
  return row ? toListingRow<ListingRow>(row) : undefined;
}

export async function listingsManagedBy(userId: string, q: Db = db()): Promise<ListingRow[]> {
  return ((await q("listings").select(cols()).where(managedBy(userId, q)).orderBy("listings.updated_at", "desc")) as Record<string, unknown>[]).map((r) => toListingRow<ListingRow>(r));
}

export async function updateManagedListing(id: string, userId: string, patch: ListingPatch, q: Db = db()): Promise<number> {
  return q("listings")
    .where("listings.id", id)
    .andWhere(managedBy(userId, q))
    .update({ ...patch, ...(patch.quality !== undefined ? { quality: JSON.stringify(patch.quality) } : {}), updated_at: nowIso() });
}

/**
 * Sets the total, but only while it still covers what is held or collected: a conditional
 * update, so a reservation landing in between cannot be left with more held than exists.
 */
export async function setQuantityTotal(id: string, total: number, q: Db = db()): Promise<boolean> {
  const n = await q("listings")
    .where({ id })
    .andWhereRaw("quantity_held + quantity_collected <= ?", [total + 1e-9])
    .update({ quantity_total: total, updated_at: nowIso() });
  return n === 1;
}

/** Moves the status only from one of `from`: two clicks racing cannot both apply. */
export async function moveStatus(id: string, from: readonly ListingStatus[], to: ListingStatus, q: Db = db()): Promise<boolean> {
  const n = await q("listings").where({ id }).whereIn("status", [...from]).update({ status: to, updated_at: nowIso() });
  return n === 1;
}

/** Listings past their end date stop being offered; returns how many changed. */
export async function expireListings(now: string, q: Db = db()): Promise<number> {
  return q("listings")
    .whereIn("status", ["active", "paused"])
    .whereNotNull("available_until")
    .andWhere("available_until", "<=", now)
    .update({ status: "expired", updated_at: now });
}

/** Display names, organisation names and verification of the people behind listings. */
export async function suppliersOf(ownerIds: string[], q: Db = db()) {
  const out = new Map<string, { id: string; name: string; verified: boolean }>();
  if (ownerIds.length === 0) return out;
  const rows: { id: string; display_name: string; verified_at: string | null }[] = await q("users")
    .select("id", "display_name", "verified_at")
    .whereIn("id", [...new Set(ownerIds)]);
  for (const r of rows) out.set(r.id, { id: r.id, name: r.display_name, verified: Boolean(r.verified_at) });
  return out;
}

export async function organisationNames(orgIds: string[], q: Db = db()): Promise<Map<string, string>> {
  const ids = [...new Set(orgIds.filter(Boolean))];
  if (ids.length === 0) return new Map();
  const rows: { id: string; name: string }[] = await q("organisations").select("id", "name").whereIn("id", ids);
  return new Map(rows.map((r) => [r.id, r.name]));
}
