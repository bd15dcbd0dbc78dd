import "server-only";
import { checkedInBookings, collectedReservations, type DiversionScope } from "@/db/diversion";
import { MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { summariseDiversion, type DiversionRecord } from "@/lib/calc/diversion";
import type { ListingUnit } from "@/lib/calc/units";
import { DiversionReport } from "@/lib/figures/diversion-csv";
import { resolveContext, type Context } from "@/lib/services/context";

/** What left a supplier's, grower's or council's hands; `null` scope is the whole platform. */
export async function diversionReport(scope: DiversionScope | null, opts: { from?: string; to?: string } = {}, ctx: Context = {}): Promise<DiversionReport> {
  const { db: q } = resolveContext(ctx);
  const [collected, checkedIn] = await Promise.all([collectedReservations(scope, q), checkedInBookings(scope, q)]);
  const records: DiversionRecord[] = [
    ...collected.map((r) => record(r)),
    ...checkedIn.map((r) => ({ ...record(r), day: { id: r.day_id, date: r.date, title: r.title } })),
  ].filter((r) => (!opts.from || r.month >= opts.from) && (!opts.to || r.month <= opts.to));
  const summary = summariseDiversion(records);
  return {
    ...summary,
    densities: summary.by_material.map(({ material }) => ({ material, bulk_density_kg_m3: MATERIALS[material].bulk_density_kg_m3, source: MATERIALS[material].source })),
  };
}

// Rows have their declared types on both engines (db/dialect.ts): `at` is ISO text.
function record(r: { quantity: number; household: string; at: string; material_code: string; unit: string; unit_size: number | null; unit_mass_kg?: number | null }): DiversionRecord {
  return {
    material: r.material_code as MaterialCode,
    quantity: r.quantity,
    unit: r.unit as ListingUnit,
    unitSize: r.unit_size ?? undefined,
    unitMassKg: r.unit_mass_kg ?? undefined,
    month: r.at.slice(0, 7),
    household: r.household,
  };
}

/** Kilograms kept from disposal across Duffbank, the home page's figure: collected reservations only. */
export async function platformDivertedKg(ctx: Context = {}): Promise<number> {
  const { db: q } = resolveContext(ctx);
  return summariseDiversion((await collectedReservations(null, q)).map((r) => record(r))).total_kg;
}

/** Kilograms households took home from council giveaway days (checked in), shown apart from the figure above. */
export async function platformGiveawayKg(ctx: Context = {}): Promise<number> {
  const { db: q } = resolveContext(ctx);
  return summariseDiversion((await checkedInBookings(null, q)).map((r) => record(r))).total_kg;
}

