import "server-only";
import { checkedInBookings, collectedReservations, type DiversionScope } from "@/db/diversion";
import { MATERIALS } from "@/lib/calc/facts";
import { summariseDiversion, type DiversionRecord } from "@/lib/calc/diversion";
import { DiversionReport } from "@/lib/figures/diversion-csv";
import { resolveContext, type Context } from "@/lib/context";
import { diversionRecord } from "@/lib/services/figures/steps/diversion-record";

/** What left a supplier's, grower's or council's hands; `null` scope is the whole platform. */
export async function diversionReport(scope: DiversionScope | null, opts: { from?: string; to?: string } = {}, ctx: Context = {}): Promise<DiversionReport> {
  const { db: q } = resolveContext(ctx);
  const [collected, checkedIn] = await Promise.all([collectedReservations(scope, q), checkedInBookings(scope, q)]);
  const records: DiversionRecord[] = [
    ...collected.map((r) => diversionRecord(r)),
    ...checkedIn.map((r) => ({ ...diversionRecord(r), day: { id: r.day_id, date: r.date, title: r.title } })),
  ].filter((r) => (!opts.from || r.month >= opts.from) && (!opts.to || r.month <= opts.to));
  const summary = summariseDiversion(records);
  return {
    ...summary,
    densities: summary.by_material.map(({ material }) => ({ material, bulk_density_kg_m3: MATERIALS[material].bulk_density_kg_m3, source: MATERIALS[material].source })),
  };
}
