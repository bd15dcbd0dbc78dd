import "server-only";
import { bedTotals } from "@/db/beds";
import { countVisibleListings } from "@/db/listing-status";
import { platformDivertedKg, platformGiveawayKg } from "@/lib/services/figures/report-diversion";

/** The community's figures the home page tells its story with. */
export async function communityFigures() {
  const [keptKg, giveawayKg, onOffer, beds] = await Promise.all([platformDivertedKg(), platformGiveawayKg(), countVisibleListings(), bedTotals()]);
  return { keptKg, giveawayKg, onOffer, beds: beds.beds, bedAreaM2: beds.area_m2 };
}
