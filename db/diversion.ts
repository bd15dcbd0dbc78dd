import { db, type Db } from "./index";

export interface CollectedRow {
  quantity: number;
  household: string;
  /** ISO text on both engines (db/dialect.ts). */
  at: string;
  material_code: string;
  unit: string;
  unit_size: number | null;
  /** A bag's or bale's stated weight; giveaway days state none. */
  unit_mass_kg?: number | null;
}

export interface CheckedInRow extends CollectedRow {
  day_id: string;
  date: string;
  title: string;
}

export interface DiversionScope {
  userId?: string;
  organisationId?: string | null;
}

/**
 * Collected reservations in listing units, with the listing's unit and size. The month is
 * the reservation's closed_at (set when it is collected), or updated_at for a row written
 * before that column existed. Without a scope: the whole platform.
 */
export async function collectedReservations(scope: DiversionScope | null, q: Db = db()): Promise<CollectedRow[]> {
  const query = q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .select("r.quantity", "r.gardener_id as household", q.raw("COALESCE(r.closed_at, r.updated_at) as at"), "l.material_code", "l.unit", "l.unit_size", "l.unit_mass_kg")
    .where("r.status", "collected");
  if (scope) {
    query.where((w) => {
      w.where("l.owner_id", scope.userId ?? "");
      if (scope.organisationId) w.orWhere("l.organisation_id", scope.organisationId);
    });
  }
  return query;
}

/** Households checked in at giveaway days, in the day's unit. */
export async function checkedInBookings(scope: DiversionScope | null, q: Db = db()): Promise<CheckedInRow[]> {
  if (scope && !scope.organisationId) return [];
  const query = q("giveaway_bookings as b")
    .join("giveaway_days as d", "d.id", "b.day_id")
    .select("b.quantity", "b.user_id as household", "d.date as at", "d.material_code", "d.unit", "d.unit_size", "d.id as day_id", "d.date", "d.title")
    .where("b.status", "checked_in");
  if (scope) query.where("d.organisation_id", scope.organisationId!);
  return query;
}
