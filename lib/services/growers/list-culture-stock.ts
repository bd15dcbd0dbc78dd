import "server-only";
import { wormListingsOf } from "@/db/grower-shipping";
import { estimatedWorms } from "@/lib/reservations/culture-orders";
import { packOf } from "@/lib/listings/packs";
import { CultureStock } from "@/lib/services/growers/get-grower-shipping";
import { resolveContext, type Context } from "@/lib/context";

/** The grower's worm listings with what is left and roughly how many worms that is. */
export async function cultureStock(userId: string, ctx: Context = {}): Promise<CultureStock[]> {
  const { db: q } = resolveContext(ctx);
  return (await wormListingsOf(userId, q)).map((l) => {
    const quality = l.quality;
    const left = Math.max(0, l.quantity_total - l.quantity_held - l.quantity_collected);
    return {
      id: l.id,
      title: l.title,
      status: l.status,
      kg_left: left,
      kg_held: l.quantity_held,
      // About 1,000 worms per lb (common practice, no source), to the hundred.
      estimated_count: estimatedWorms(left),
      species: typeof quality.species === "string" && quality.species.trim() ? quality.species : null,
      ships: quality.ships !== false,
      pickup: quality.pickup !== false,
      price_cents: l.price_cents,
      pack: packOf(l),
      currency: l.currency,
    };
  });
}
