import type { Box } from "@/lib/geo/box";
import { byteOrder, lockForUpdate } from "./dialect";
import { db, newId, nowIso, type Db } from "./index";
import type { BookingStatus, GiveawayBookingRow, GiveawayDayRow, GiveawaySlotRow } from "./types";

const DAY_COLUMNS = [
  "id",
  "organisation_id",
  "created_by",
  "material_code",
  "title",
  "notes",
  "date",
  "time_zone",
  "lat",
  "lng",
  "address",
  "approx_lat",
  "approx_lng",
  "unit",
  "unit_size",
  "household_cap",
  "booking_opens_at",
  "booking_closes_at",
  "cancel_cutoff_hours",
  "deposit_cents",
  "currency",
  "status",
  "cancel_reason",
  "cancelled_at",
  "created_at",
  "updated_at",
];
const SLOT_COLUMNS = ["id", "day_id", "starts_at", "ends_at", "capacity", "booked", "created_at"];
const BOOKING_COLUMNS = [
  "id",
  "day_id",
  "slot_id",
  "user_id",
  "quantity",
  "status",
  "deposit_cents",
  "deposit_status",
  "currency",
  "hold_expires_at",
  "checked_in_at",
  "checked_in_by",
  "cancelled_at",
  "created_at",
  "updated_at",
];

export type DayWrite = Omit<GiveawayDayRow, "id" | "status" | "cancel_reason" | "cancelled_at" | "created_at" | "updated_at">;

// ---- days ------------------------------------------------------------------------------

export async function insertDay(row: DayWrite & { id?: string }, q: Db = db()): Promise<string> {
  const id = row.id ?? newId();
  const now = nowIso();
  await q("giveaway_days").insert({ ...row, id, status: "scheduled", created_at: now, updated_at: now });
  return id;
}

export async function findDay(id: string, q: Db = db()): Promise<GiveawayDayRow | undefined> {
  return (await q("giveaway_days").first(DAY_COLUMNS).where({ id })) as GiveawayDayRow | undefined;
}

/** A day of another organisation is simply not found. `lock`: held until `q` ends (FOR UPDATE on PostgreSQL). */
export async function findOrgDay(id: string, organisationId: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<GiveawayDayRow | undefined> {
  return (await lockForUpdate(q("giveaway_days").first(DAY_COLUMNS).where({ id, organisation_id: organisationId }), opts.lock)) as GiveawayDayRow | undefined;
}

export async function updateOrgDay(id: string, organisationId: string, patch: Partial<GiveawayDayRow>, q: Db = db()): Promise<number> {
  return q("giveaway_days").where({ id, organisation_id: organisationId }).update({ ...patch, updated_at: nowIso() });
}

/** Moves a scheduled day to cancelled; 0 when it was not scheduled (or not this organisation's). */
export async function cancelOrgDay(id: string, organisationId: string, reason: string, q: Db = db()): Promise<number> {
  const now = nowIso();
  return q("giveaway_days")
    .where({ id, organisation_id: organisationId, status: "scheduled" })
    .update({ status: "cancelled", cancel_reason: reason, cancelled_at: now, updated_at: now });
}

export async function listOrgDays(organisationId: string, q: Db = db()): Promise<GiveawayDayRow[]> {
  return q("giveaway_days").select(DAY_COLUMNS).where({ organisation_id: organisationId }).orderBy("date", "desc");
}

/** Scheduled days from `fromDate` on; with a box, only those whose public point is inside it (index prefilter). */
export async function upcomingDays(
  opts: { fromDate: string; box?: Box },
  q: Db = db(),
): Promise<GiveawayDayRow[]> {
  const query = q("giveaway_days").select(DAY_COLUMNS).where("status", "scheduled").andWhere("date", ">=", opts.fromDate);
  if (opts.box) {
    query.whereBetween("approx_lat", [opts.box.minLat, opts.box.maxLat]).whereBetween("approx_lng", [opts.box.minLng, opts.box.maxLng]);
  }
  return query.orderBy([{ column: "date" }, { column: "id" }]);
}

// ---- slots -----------------------------------------------------------------------------

export async function insertSlots(dayId: string, slots: { starts_at: string; ends_at: string; capacity: number; id?: string }[], q: Db = db()): Promise<string[]> {
  const now = nowIso();
  const rows = slots.map((s) => ({ id: s.id ?? newId(), day_id: dayId, starts_at: s.starts_at, ends_at: s.ends_at, capacity: s.capacity, booked: 0, created_at: now }));
  if (rows.length) await q("giveaway_slots").insert(rows);
  return rows.map((r) => r.id);
}

export async function slotsOf(dayIds: string[], q: Db = db()): Promise<GiveawaySlotRow[]> {
  if (!dayIds.length) return [];
  return q("giveaway_slots").select(SLOT_COLUMNS).whereIn("day_id", dayIds).orderBy([{ column: "starts_at" }, { column: "id" }]);
}

export async function findSlot(id: string, dayId: string, q: Db = db()): Promise<GiveawaySlotRow | undefined> {
  return (await q("giveaway_slots").first(SLOT_COLUMNS).where({ id, day_id: dayId })) as GiveawaySlotRow | undefined;
}

/**
 * Takes one household's place in a slot if there is room and the day is still taking bookings
 * at `nowIso` (not cancelled, inside its booking window): the conditions are in the UPDATE, so
 * two bookings at once cannot both take the last place, and a booking racing the day being
 * called off cannot land on it. Returns whether it did.
 */
export async function takeSlotPlace(slotId: string, dayId: string, nowIso: string, q: Db = db()): Promise<boolean> {
  const n = await q("giveaway_slots")
    .where({ id: slotId, day_id: dayId })
    .andWhereRaw("booked < capacity")
    .whereExists((sub) =>
      sub
        .select(q.raw("1"))
        .from("giveaway_days")
        .whereRaw("giveaway_days.id = giveaway_slots.day_id")
        .andWhere("giveaway_days.status", "scheduled")
        .andWhere("giveaway_days.booking_opens_at", "<=", nowIso)
        .andWhere("giveaway_days.booking_closes_at", ">", nowIso),
    )
    .increment("booked", 1);
  return n === 1;
}

export async function releaseSlotPlace(slotId: string, q: Db = db()): Promise<void> {
  await q("giveaway_slots").where({ id: slotId }).andWhere("booked", ">", 0).decrement("booked", 1);
}

/** Changes a slot's size, never below the households already in it. */
export async function resizeSlot(slotId: string, dayId: string, capacity: number, q: Db = db()): Promise<number> {
  return q("giveaway_slots").where({ id: slotId, day_id: dayId }).andWhere("booked", "<=", capacity).update({ capacity });
}

/** Removes a slot nobody has booked. */
export async function deleteEmptySlot(slotId: string, dayId: string, q: Db = db()): Promise<number> {
  const inUse = q("giveaway_bookings").select("id").where({ slot_id: slotId });
  return q("giveaway_slots").where({ id: slotId, day_id: dayId, booked: 0 }).whereNotExists(inUse).delete();
}

/** Moves every slot of a day by `shiftMs` (the day's date changed before anyone booked). */
export async function shiftSlots(dayId: string, slots: GiveawaySlotRow[], shiftMs: number, q: Db = db()): Promise<void> {
  for (const s of slots) {
    await q("giveaway_slots")
      .where({ id: s.id, day_id: dayId })
      .update({ starts_at: new Date(Date.parse(s.starts_at) + shiftMs).toISOString(), ends_at: new Date(Date.parse(s.ends_at) + shiftMs).toISOString() });
  }
}

/** Makes each slot's count match its live bookings again (after a day is called off). */
export async function recountSlots(dayId: string, q: Db = db()): Promise<void> {
  await q.raw(
    `UPDATE giveaway_slots SET booked = (SELECT COUNT(*) FROM giveaway_bookings b WHERE b.slot_id = giveaway_slots.id AND b.status <> 'cancelled') WHERE day_id = ?`,
    [dayId],
  );
}

// ---- bookings --------------------------------------------------------------------------

export async function insertBooking(
  row: Pick<GiveawayBookingRow, "day_id" | "slot_id" | "user_id" | "quantity" | "deposit_cents" | "deposit_status" | "currency"> & { hold_expires_at?: string | null },
  q: Db = db(),
): Promise<GiveawayBookingRow> {
  const now = nowIso();
  const full = { id: newId(), ...row, status: "booked" as const, created_at: now, updated_at: now };
  await q("giveaway_bookings").insert(full);
  return (await findBooking(full.id, q))!;
}

/** `lock`: held until `q` ends (FOR UPDATE on PostgreSQL), for a transaction that decides on what it reads. */
export async function findBooking(id: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<GiveawayBookingRow | undefined> {
  return (await lockForUpdate(q("giveaway_bookings").first(BOOKING_COLUMNS).where({ id }), opts.lock)) as GiveawayBookingRow | undefined;
}

/** The household's live booking for a day (anything not cancelled). */
export async function liveBookingFor(dayId: string, userId: string, q: Db = db()): Promise<GiveawayBookingRow | undefined> {
  return (await q("giveaway_bookings").first(BOOKING_COLUMNS).where({ day_id: dayId, user_id: userId }).whereNot("status", "cancelled")) as
    | GiveawayBookingRow
    | undefined;
}

/** Moves a booking from one of `from` to `to`; 0 when it was in another state (or not found). */
export async function setBookingStatus(
  where: { id: string; day_id?: string; user_id?: string },
  from: BookingStatus[],
  to: BookingStatus,
  extra: Partial<GiveawayBookingRow> = {},
  q: Db = db(),
): Promise<number> {
  return q("giveaway_bookings")
    .where(where)
    .whereIn("status", from)
    .update({ status: to, ...extra, updated_at: nowIso() });
}

export interface SheetRow {
  id: string;
  slot_id: string;
  user_id: string;
  quantity: number;
  status: BookingStatus;
  deposit_cents: number;
  deposit_status: string;
  checked_in_at: string | null;
  created_at: string;
  name: string;
  email: string;
  starts_at: string;
  ends_at: string;
}

/** Everyone booked on a day, slot by slot: the day's sheet. */
export async function sheetFor(dayId: string, opts: { includeCancelled?: boolean } = {}, q: Db = db()): Promise<SheetRow[]> {
  const query = q("giveaway_bookings as b")
    .join("users as u", "u.id", "b.user_id")
    .join("giveaway_slots as s", "s.id", "b.slot_id")
    .select(
      "b.id",
      "b.slot_id",
      "b.user_id",
      "b.quantity",
      "b.status",
      "b.deposit_cents",
      "b.deposit_status",
      "b.checked_in_at",
      "b.created_at",
      "u.display_name as name",
      "u.email",
      "s.starts_at",
      "s.ends_at",
    )
    .where("b.day_id", dayId);
  if (!opts.includeCancelled) query.whereNot("b.status", "cancelled");
  return query.orderBy([{ column: "s.starts_at" }, { column: byteOrder(q, "u.display_name") }, { column: byteOrder(q, "b.id") }]);
}

export interface MyBookingRow extends GiveawayBookingRow {
  title: string;
  material_code: string;
  date: string;
  time_zone: string;
  address: string;
  unit: "bags" | "m3";
  day_status: string;
  cancel_cutoff_hours: number;
  starts_at: string;
  ends_at: string;
}

/** A household's bookings with their day and slot, soonest first. */
export async function bookingsOf(userId: string, opts: { fromDate?: string } = {}, q: Db = db()): Promise<MyBookingRow[]> {
  const query = q("giveaway_bookings as b")
    .join("giveaway_days as d", "d.id", "b.day_id")
    .join("giveaway_slots as s", "s.id", "b.slot_id")
    .select(
      ...BOOKING_COLUMNS.map((c) => `b.${c}`),
      "d.title",
      "d.material_code",
      "d.date",
      "d.time_zone",
      "d.address",
      "d.unit",
      "d.status as day_status",
      "d.cancel_cutoff_hours",
      "s.starts_at",
      "s.ends_at",
    )
    .where("b.user_id", userId);
  if (opts.fromDate) query.andWhere("d.date", ">=", opts.fromDate);
  return query.orderBy([{ column: "s.starts_at" }, { column: "b.id" }]);
}
