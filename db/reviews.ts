import { db, type Db } from "./index";

/** Average rating and count per reviewed person, for the names shown on listings. */
export async function ratingsFor(userIds: string[], q: Db = db()): Promise<Map<string, { average: number; count: number }>> {
  const out = new Map<string, { average: number; count: number }>();
  if (userIds.length === 0) return out;
  const rows: { subject_id: string; average: number; count: number }[] = await q("reviews")
    .select("subject_id")
    .avg({ average: "rating" })
    .count({ count: "*" })
    .whereIn("subject_id", [...new Set(userIds)])
    .groupBy("subject_id");
  for (const r of rows) out.set(r.subject_id, { average: Math.round(Number(r.average) * 10) / 10, count: Number(r.count) });
  return out;
}
