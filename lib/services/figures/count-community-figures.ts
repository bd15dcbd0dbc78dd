import "server-only";
import { bedTotals } from "@/db/beds";
import { countVisibleListings } from "@/db/listing-status";
import { platformDivertedKg, platformGiveawayKg } from "@/lib/services/figures/steps/platform-kilograms";
import { resolveContext, type Context } from "@/lib/context";

/** The community's figures the home page tells its story with. */
export async function communityFigures(ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const [keptKg, giveawayKg, onOffer, beds] = await Promise.all([platformDivertedKg({ db: q, clock }), platformGiveawayKg({ db: q, clock }), countVisibleListings(q), bedTotals(q)]);
  return { keptKg, giveawayKg, onOffer, beds: beds.beds, bedAreaM2: beds.area_m2 };
}
