import "server-only";
import { checkedInBookings, collectedReservations } from "@/db/diversion";
import { summariseDiversion } from "@/lib/calc/diversion";
import { resolveContext, type Context } from "@/lib/context";
import { diversionRecord } from "@/lib/services/figures/steps/diversion-record";

// The whole platform's kilograms, kept apart: what suppliers' collected reservations kept from
// disposal, and what households took home from council giveaway days.

/** Kilograms kept from disposal across Duffbank, the home page's figure: collected reservations only. */
export async function platformDivertedKg(ctx: Context = {}): Promise<number> {
  const { db: q } = resolveContext(ctx);
  return summariseDiversion((await collectedReservations(null, q)).map((r) => diversionRecord(r))).total_kg;
}

/** Kilograms households took home from council giveaway days (checked in), shown apart from the figure above. */
export async function platformGiveawayKg(ctx: Context = {}): Promise<number> {
  const { db: q } = resolveContext(ctx);
  return summariseDiversion((await checkedInBookings(null, q)).map((r) => diversionRecord(r))).total_kg;
}
