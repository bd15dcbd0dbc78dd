import { db, type Db } from "./index";

/**
 * Average rating and count per supplier, for the names shown on listings: only what gardeners
 * said of them as suppliers (a supplier who also collects as a gardener is rated apart there).
 */
export async function ratingsFor(userIds: string[], q: Db = db()): Promise<Map<string, { average: number; count: number }>> {
  const out = new Map<string, { average: number; count: number }>();
  if (userIds.length === 0) return out;
  const rows: { subject_id: string; average: number; count: number }[] = await q("reviews as v")
    .join("reservations as r", "r.id", "v.reservation_id")
    .select("v.subject_id")
    .avg({ average: "v.rating" })
    .count({ count: "*" })
    .whereIn("v.subject_id", [...new Set(userIds)])
    .whereRaw("v.author_id = r.gardener_id")
    .groupBy("v.subject_id");
  for (const r of rows) out.set(r.subject_id, { average: Math.round(Number(r.average) * 10) / 10, count: Number(r.count) });
  return out;
}

/**
 * How many times gardeners have collected from each supplier's listings: the plain trust
 * figure shown beside a supplier's name ("collected from 12 times").
 */
export async function collectionsFor(userIds: string[], q: Db = db()): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  if (userIds.length === 0) return out;
  const rows: { owner_id: string; count: number | string }[] = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .select("l.owner_id")
    .count({ count: "*" })
    .whereIn("l.owner_id", [...new Set(userIds)])
    .where("r.status", "collected")
    .groupBy("l.owner_id");
  for (const r of rows) out.set(r.owner_id, Number(r.count));
  return out;
}
