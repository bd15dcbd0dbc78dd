import "server-only";
import type { Knex } from "knex";
import { reservationsCounting } from "@/db/needs";
import type { NeedRow } from "@/db/types";
import { coverage } from "@/lib/needs/coverage";
import { presentNeed, type NeedView } from "@/lib/needs/view";
import { dayOf } from "@/lib/services/needs/steps/day-of";

/** Needs as their owner sees them: what reservations cover, the bed's name, how many alerts. */
export async function needViews(rows: NeedRow[], q: Knex, now: Date): Promise<NeedView[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const bedIds = [...new Set(rows.map((r) => r.bed_id).filter((b): b is string => !!b))];
  const [reservations, beds, counts] = await Promise.all([
    reservationsCounting(rows, q),
    bedIds.length ? (q("beds").select("id", "name").whereIn("id", bedIds) as Promise<{ id: string; name: string }[]>) : Promise.resolve([]),
    q("need_alerts").select("need_id").count({ n: "*" }).whereIn("need_id", ids).groupBy("need_id") as Promise<{ need_id: string; n: number | string }[]>,
  ]);
  const bedName = new Map(beds.map((b) => [b.id, b.name]));
  const alertCount = new Map(counts.map((c) => [c.need_id, Number(c.n)]));
  const today = dayOf(now);
  return rows.map((r) =>
    presentNeed(r, { coverage: coverage(r, reservations), bedName: r.bed_id ? (bedName.get(r.bed_id) ?? null) : null, alertCount: alertCount.get(r.id) ?? 0 }, today),
  );
}
