import "server-only";
import { findShipping } from "@/db/grower-shipping";
import { cultureOptions, estimatedWorms, nextPostingDay } from "@/lib/reservations/culture-orders";
import { shippingView, type ShippingView } from "@/lib/growers/view";
import { resolveContext, type Context } from "@/lib/context";

/** What a buyer reads about a live culture before ordering: species, rough count, and how it arrives. */
export interface CultureOffer {
  species: string | null;
  /** For what is left on the listing: about 1,000 a pound (common practice, no source). */
  estimated_count: number;
  pickup: boolean;
  ships: boolean;
  /** Posting can be chosen now: offered, and not paused for heat or frost. */
  can_post: boolean;
  shipping: ShippingView;
  /** The earliest day an order placed now goes out (YYYY-MM-DD), or null. */
  next_posting_day: string | null;
}

export async function cultureOffer(l: { material: string; owner_id: string; quality: Record<string, unknown>; available: number }, ctx: Context = {}): Promise<CultureOffer | null> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  if (l.material !== "worms") return null;
  const options = cultureOptions(l.quality);
  const shipping = shippingView(await findShipping(l.owner_id, q));
  const species = typeof l.quality.species === "string" && l.quality.species.trim() ? l.quality.species.trim() : null;
  return {
    species,
    estimated_count: estimatedWorms(l.available),
    ...options,
    can_post: options.ships && !shipping.paused,
    shipping,
    next_posting_day: options.ships && !shipping.paused ? nextPostingDay(shipping.ship_weekdays, now) : null,
  };
}
