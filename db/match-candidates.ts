import "server-only";
import type { Knex } from "knex";
import { db, type Db } from "./index";
import { isPg, nearBox } from "@/db/dialect";
import { listingsInBox } from "@/db/listing-points";
import type { MaterialCode } from "@/lib/calc/facts";
import { packOf, type Pack, type PackColumns } from "@/lib/listings/packs";
import { UNIT_PRICE_INDEX, UNIT_PRICE_SQL } from "@/migrations/20261201_004_listing_unit_price";
import { type Box, boundingBox } from "@/lib/geo/box";
import { distanceKm, enclosingCircle } from "@/lib/match/geo";
import type { CandidateSource, CheapestRows } from "@/lib/match/search";
import type { CandidateListing, LatLng, ListingUnit } from "@/lib/match/types";
import { LISTING_COLUMNS, toListingRow } from "./listings";
import type { ListingQuality } from "./types";

// The one query module of matching (a repository: matching itself, lib/match, does no I/O). Every query names its index: a box on the public
// point through the spatial index (db/listing-points.ts: an R*Tree on SQLite, listings_near,
// a GiST index of points in space, on PostgreSQL), or the price order through
// listings_unit_price (status, material_code, unit price, approx_lat, approx_lng); then Turf's
// exact distance decides. None reads the whole table. SQLite is told which index to use for
// the price order. On PostgreSQL each box also asks for the cube around the circle that holds
// it (db/dialect.ts nearBox), so the same rows come back either way.

const COLUMNS = [
  "id",
  "material_code",
  "unit",
  "unit_size",
  "unit_mass_kg",
  "quantity_total",
  "quantity_held",
  "quantity_collected",
  "max_per_reservation",
  "price_cents",
  "pack_size",
  "pack_price_cents",
  "currency",
  "approx_lat",
  "approx_lng",
  "quality",
] as const satisfies readonly (typeof LISTING_COLUMNS)[number][];

interface Row {
  id: string;
  material_code: MaterialCode;
  unit: ListingUnit;
  unit_size: number | null;
  unit_mass_kg: number | null;
  quantity_total: number;
  quantity_held: number;
  quantity_collected: number;
  max_per_reservation: number | null;
  price_cents: number;
  pack_size: number | null;
  pack_price_cents: number | null;
  currency: string;
  approx_lat: number;
  approx_lng: number;
  quality: string | null;
  unit_price?: number;
}

// Float quantities can leave a residue like 1e-12 behind a full reservation.
const LEFT_EPS = 1e-9;

const table = (q: Db, index: string) => (isPg(q) ? "listings" : q.raw(`listings INDEXED BY ${index}`));

/**
 * Active, with something left, within its dates (begun, not ended), inside the box: found
 * through the spatial index, or with `index` (one that holds the point) read in its order.
 */
function reservable(q: Db, index: string | null, materials: readonly MaterialCode[], box: Box, now: Date): Knex.QueryBuilder {
  const from: Knex.QueryBuilder = index
    ? q.from(table(q, index)).whereIn("material_code", [...materials]).whereBetween("approx_lat", [box.minLat, box.maxLat]).whereBetween("approx_lng", [box.minLng, box.maxLng])
    : listingsInBox(q, box, materials);
  const qb = from
    .select(COLUMNS.map((c) => `listings.${c}`))
    .where("listings.status", "active")
    .whereRaw("quantity_total - quantity_held - quantity_collected > ?", [LEFT_EPS])
    .where((w) => w.whereNull("available_until").orWhere("available_until", ">", now.toISOString()))
    // Browse shows a listing ahead of its start date; a plan can only use what can be reserved now.
    .where((w) => w.whereNull("available_from").orWhere("available_from", "<=", now.toISOString()));
  // The price-ordered queries read listings_unit_price in price order on both engines.
  const circle = index === UNIT_PRICE_INDEX ? null : enclosingCircle(box);
  return circle ? nearBox(qb, circle.centre, circle.km * 1000) : qb;
}

/** A live culture its grower only posts (lib/reservations/culture-orders.ts: an unset key means offered). */
function postedOnly(r: Row): boolean {
  if (r.material_code !== "worms") return false;
  const q = toListingRow<{ quality: ListingQuality }>(r).quality;
  return q.pickup === false && q.ships !== false;
}

function toCandidate(r: Row, origin: LatLng): CandidateListing {
  const posted = postedOnly(r);
  // A parcel comes to the start: planned there, it adds no driving and no detour.
  const location = posted ? origin : { lat: Number(r.approx_lat), lng: Number(r.approx_lng) };
  return {
    id: r.id,
    material: r.material_code,
    unit: r.unit,
    unit_size: r.unit_size === null ? null : Number(r.unit_size),
    unit_mass_kg: r.unit_mass_kg === null ? null : Number(r.unit_mass_kg),
    available: Number(r.quantity_total) - Number(r.quantity_held) - Number(r.quantity_collected),
    max_per_reservation: r.max_per_reservation === null ? null : Number(r.max_per_reservation),
    price_cents: Number(r.price_cents),
    pack: packOf(r),
    currency: r.currency,
    location,
    distance_km: posted ? 0 : distanceKm(origin, location),
    ...(posted ? { posted } : {}),
  };
}

export interface CandidateQuery {
  origin: LatLng;
  radius_km: number;
  materials: readonly MaterialCode[];
  now?: Date;
}

/** Every reservable listing of `materials` whose public point lies in `box`, with its distance from `origin`. */
export async function findInBox(
  materials: readonly MaterialCode[],
  box: Box,
  origin: LatLng,
  opts: { now?: Date; maxUnitPrice?: number } = {},
  q: Db = db(),
): Promise<CandidateListing[]> {
  if (!materials.length) return [];
  const now = opts.now ?? new Date();
  // Under a price cap the price index reads only the listings that cheap.
  const rows: Row[] =
    opts.maxUnitPrice === undefined
      ? await reservable(q, null, materials, box, now)
      : await reservable(q, UNIT_PRICE_INDEX, materials, box, now).whereRaw(`${UNIT_PRICE_SQL} <= ?`, [opts.maxUnitPrice]);
  return rows.map((r) => toCandidate(r, origin));
}

/** Every reservable listing of `materials` within `radius_km` of `origin`, by its public point. */
export async function findCandidates({ origin, radius_km, materials, now = new Date() }: CandidateQuery, q: Db = db()): Promise<CandidateListing[]> {
  const found = await findInBox(materials, boundingBox(origin, radius_km), origin, { now }, q);
  return found.filter((c) => c.distance_km <= radius_km);
}

/** The same, cheapest per unit size first, reading at most `limit` rows of the index. */
export async function findCheapest(query: CandidateQuery & { limit: number }, q: Db = db()): Promise<CheapestRows> {
  const { origin, radius_km, materials, limit, now = new Date() } = query;
  const rows: Row[] = await reservable(q, UNIT_PRICE_INDEX, materials, boundingBox(origin, radius_km), now)
    .select(q.raw(`${UNIT_PRICE_SQL} AS unit_price`))
    .orderByRaw(UNIT_PRICE_SQL)
    .limit(limit);
  const last = rows.length === limit ? Number(rows[rows.length - 1].unit_price) : null;
  return { rows: rows.map((r) => toCandidate(r, origin)).filter((c) => c.distance_km <= radius_km), last_unit_price: last };
}

/**
 * The `limit` nearest reservable listings within `radius_km`, nearest first: boxes that
 * double until they hold `limit` listings inside their circle (nothing outside a circle
 * can be nearer than what is in it) or reach the radius.
 */
export async function nearestListings(
  query: CandidateQuery & { limit: number; start_km?: number },
  q: Db = db(),
): Promise<CandidateListing[]> {
  const { radius_km, limit } = query;
  let km = Math.min(radius_km, query.start_km ?? 1);
  for (;;) {
    const found = await findCandidates({ ...query, radius_km: km }, q);
    if (found.length >= limit || km >= radius_km) return found.sort((a, b) => a.distance_km - b.distance_km).slice(0, limit);
    km = Math.min(radius_km, km * 2);
  }
}

/** Matching's view of the database. */
export function databaseSource(q: Db = db(), now: Date = new Date()): CandidateSource {
  return {
    inBox: (materials, box, origin, maxUnitPrice) => findInBox(materials, box, origin, { now, maxUnitPrice }, q),
    cheapest: (material, origin, radius_km, limit) => findCheapest({ origin, radius_km, materials: [material], limit, now }, q),
  };
}

/** A listing with what it holds and costs, as a plan prices it (public fields only). */
export interface PricedListing {
  id: string;
  title: string;
  supplier: string;
  material: MaterialCode;
  unit: ListingUnit;
  unit_size: number | null;
  unit_mass_kg: number | null;
  price_cents: number;
  /** Sold by the pack: whole packs at the pack price. */
  pack: Pack | null;
  deposit_cents: number;
  currency: string;
  auto_accept: boolean;
}

/**
 * The listings a plan chose, or a gardener named, with their prices: those anyone may see
 * (not drafts, not hidden by a moderator). Missing ids are simply absent.
 */
export async function pricedListings(ids: readonly string[], q: Db = db()): Promise<Record<string, PricedListing>> {
  if (!ids.length) return {};
  const rows = await q("listings as l")
    .join("users as u", "u.id", "l.owner_id")
    .select("l.id", "l.title", "u.display_name as supplier", "l.material_code", "l.unit", "l.unit_size", "l.unit_mass_kg", "l.price_cents", "l.pack_size", "l.pack_price_cents", "l.deposit_cents", "l.currency", "l.auto_accept")
    .whereIn("l.id", [...ids])
    .whereNotIn("l.status", ["draft", "hidden"]);
  const num = (x: unknown) => (x === null || x === undefined ? null : Number(x));
  return Object.fromEntries(
    rows.map((r: Record<string, unknown>) => [
      r.id,
      {
        id: String(r.id),
        title: String(r.title),
        supplier: String(r.supplier),
        material: r.material_code as MaterialCode,
        unit: r.unit as ListingUnit,
        unit_size: num(r.unit_size),
        unit_mass_kg: num(r.unit_mass_kg),
        price_cents: Number(r.price_cents),
        pack: packOf(r as PackColumns),
        deposit_cents: Number(r.deposit_cents),
        currency: String(r.currency),
        auto_accept: Boolean(r.auto_accept),
      },
    ]),
  );
}
