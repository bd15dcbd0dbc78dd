import { db, newId, type Db } from "./index";
import type { ReservationMessageRow } from "./types";

export async function insertMessage(m: Omit<ReservationMessageRow, "id">, q: Db = db()): Promise<ReservationMessageRow> {
  const row = { id: newId(), ...m };
  await q("reservation_messages").insert(row);
  return row;
}

export async function messagesOf(reservationId: string, q: Db = db()): Promise<(ReservationMessageRow & { author_name: string })[]> {
  return q("reservation_messages as m")
    .join("users as u", "u.id", "m.author_id")
    .select("m.id", "m.reservation_id", "m.author_id", "m.body", "m.created_at", "u.display_name as author_name")
    .where("m.reservation_id", reservationId)
    .orderBy([{ column: "m.created_at" }, { column: "m.id" }]);
}

export async function countMessagesSince(reservationId: string, authorId: string, since: string, q: Db = db()): Promise<number> {
  const [{ n }] = await q("reservation_messages").count({ n: "*" }).where({ reservation_id: reservationId, author_id: authorId }).andWhere("created_at", ">", since);
  return Number(n);
}
