import type { Knex } from "knex";
import { lockForUpdate } from "./dialect";
import { db, type Db } from "./index";
import { LISTING_COLUMNS, toListingRow } from "./listings";
import { windowsFor } from "./pickup-windows";
import type { ListingRow, PickupWindowRow, ReservationEventRow, ReservationRow } from "./types";

export type { PickupWindowRow };

// Reservations, their status history, and the listing quantities they move. Every change
// of a listing's quantity is one conditional UPDATE, so concurrent requests cannot hold
// more than is there (the table's own triggers/CHECK are the last line of defence).

const EPSILON = 1e-9;

/** The listing as the reservation code reads it: the listings repository's own row. */
export type ListingForReservation = ListingRow;

export async function listingsForReservation(ids: string[], q: Db = db()): Promise<ListingForReservation[]> {
  return ((await q("listings").select(LISTING_COLUMNS).whereIn("id", ids)) as Record<string, unknown>[]).map((r) => toListingRow<ListingForReservation>(r));
}

export const availableOf = (l: Pick<ListingForReservation, "quantity_total" | "quantity_held" | "quantity_collected">) =>
  Math.max(0, l.quantity_total - l.quantity_held - l.quantity_collected);

/** Holds `quantity` if that much is still free on an active listing; false otherwise. */
export async function holdQuantity(listingId: string, quantity: number, q: Db = db()): Promise<boolean> {
  const n = await q("listings")
    .where({ id: listingId, status: "active" })
    .andWhereRaw("quantity_total - quantity_held - quantity_collected >= ?", [quantity - EPSILON])
    .update({ quantity_held: q.raw("quantity_held + ?", [quantity]) });
  return n === 1;
}

// Floating-point sums of fractional m³ can leave a hair below the amount; never go under zero.
// (CASE rather than max()/greatest(): the same SQL on SQLite and PostgreSQL.)
const lessHeld = (q: Db, quantity: number) =>
  q.raw("CASE WHEN quantity_held - ? < 0 THEN 0 ELSE quantity_held - ? END", [quantity, quantity]);

/** Gives a held quantity back (expiry, decline, cancellation, no-show). */
export async function releaseQuantity(listingId: string, quantity: number, q: Db = db()): Promise<void> {
  const n = await q("listings")
    .where({ id: listingId })
    .andWhere("quantity_held", ">=", quantity - EPSILON)
    .update({ quantity_held: lessHeld(q, quantity) });
  if (n !== 1) throw new Error(`listing ${listingId} holds less than ${quantity}`);
}

/** Moves a held quantity to collected in one statement. */
export async function collectQuantity(listingId: string, quantity: number, q: Db = db()): Promise<void> {
  const n = await q("listings")
    .where({ id: listingId })
    .andWhere("quantity_held", ">=", quantity - EPSILON)
    .update({
      quantity_held: lessHeld(q, quantity),
      quantity_collected: q.raw("quantity_collected + ?", [quantity]),
    });
  if (n !== 1) throw new Error(`listing ${listingId} holds less than ${quantity}`);
}

/** Every pickup window of these listings, in one list. */
export async function pickupWindowsOf(listingIds: string[], q: Db = db()): Promise<PickupWindowRow[]> {
  return [...(await windowsFor(listingIds, q)).values()].flat();
}

export async function insertReservation(row: ReservationRow, q: Db = db()): Promise<void> {
  await q("reservations").insert(row);
}

/** `lock`: held until `q` ends (FOR UPDATE on PostgreSQL), for a transaction that decides on what it reads. */
export async function findReservation(id: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<ReservationRow | undefined> {
  return lockForUpdate(q<ReservationRow>("reservations").first("*").where({ id }), opts.lock);
}

/**
 * Changes a reservation only if it is still in one of `from`: the check and the write are
 * one statement, so two people pressing buttons at once cannot both win.
 */
export async function updateReservationIf(
  id: string,
  from: readonly ReservationRow["status"][],
  patch: Partial<ReservationRow>,
  q: Db = db(),
  extra?: (qb: Knex.QueryBuilder) => void,
): Promise<boolean> {
  const qb = q("reservations").where({ id }).whereIn("status", from as string[]);
  if (extra) extra(qb);
  return (await qb.update(patch)) === 1;
}

export async function recordReservationEvent(
  e: { reservation_id: string; from_status: string | null; to_status: string; actor_id: string | null; note?: string | null; created_at: string },
  q: Db = db(),
): Promise<void> {
  await q("reservation_events").insert({ ...e, note: e.note?.slice(0, 240) ?? null });
}

export async function historyOf(reservationIds: string[], q: Db = db()): Promise<ReservationEventRow[]> {
  if (reservationIds.length === 0) return [];
  return q<ReservationEventRow>("reservation_events").select("*").whereIn("reservation_id", reservationIds).orderBy("id");
}

/** Listings a person answers for: their own, and their organisation's. */
export function suppliedBy(userId: string, q: Db, column = "l") {
  return (qb: Knex.QueryBuilder) =>
    qb.where(`${column}.owner_id`, userId).orWhereIn(`${column}.organisation_id`, q("memberships").select("organisation_id").where({ user_id: userId }));
}

/** Which side of a reservation a person is on, or null when it is none of their business. */
export async function sideOf(id: string, userId: string, q: Db = db()): Promise<"gardener" | "supplier" | null> {
  const row = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .first("r.gardener_id")
    .where("r.id", id)
    .andWhere((qb) => {
      qb.where("r.gardener_id", userId).orWhere(suppliedBy(userId, q));
    });
  if (!row) return null;
  return row.gardener_id === userId ? "gardener" : "supplier";
}

export async function reservationIdsFor(userId: string, side: "gardener" | "supplier", q: Db = db(), statuses?: string[]): Promise<string[]> {
  const qb = q("reservations as r").join("listings as l", "l.id", "r.listing_id").select("r.id").orderBy("r.created_at", "desc").limit(200);
  if (side === "gardener") qb.where("r.gardener_id", userId);
  else qb.where(suppliedBy(userId, q));
  if (statuses) qb.whereIn("r.status", statuses);
  return (await qb).map((r: { id: string }) => r.id);
}

export async function heldDueToExpire(now: string, limit = 50, q: Db = db()): Promise<ReservationRow[]> {
  return q<ReservationRow>("reservations").select("*").where("status", "held").andWhere("hold_expires_at", "<=", now).orderBy("hold_expires_at").limit(limit);
}

/**
 * Reservations in `status` whose `timeColumn` falls in (after, until] and whose `marker`
 * column is still empty: the ones a once-only reminder has not reached yet.
 */
export async function dueForNotice(
  status: "held" | "confirmed",
  timeColumn: "hold_expires_at" | "answer_remind_at" | "pickup_at" | "pickup_by",
  marker: "expiry_warned_at" | "pickup_reminded_at",
  after: string,
  until: string,
  limit = 50,
  q: Db = db(),
): Promise<ReservationRow[]> {
  const rows = q<ReservationRow>("reservations")
    .select("*")
    .where("status", status)
    .whereNull(marker)
    .andWhere(timeColumn, ">", after)
    .andWhere(timeColumn, "<=", until)
    .limit(limit);
  // The end of a checkout's hold warns the gardener; a request waiting for the supplier is
  // reminded half-way through its answer window instead (answer_remind_at).
  if (timeColumn === "hold_expires_at") rows.where("payment_state", "awaiting");
  if (timeColumn === "answer_remind_at") rows.whereNot("payment_state", "awaiting");
  // The deadline of a pickup with no fixed time; posted cultures have no pickup at all.
  if (timeColumn === "pickup_by") rows.whereNull("pickup_at").andWhere((b) => b.whereNull("fulfilment").orWhereNot("fulfilment", "post"));
  return rows;
}
