import "server-only";
import { findShipping } from "@/db/grower-shipping";
import { shippingView, type ShippingView } from "@/lib/growers/view";
import type { Pack } from "@/lib/listings/packs";
import { resolveContext, type Context } from "@/lib/context";

export async function growerShipping(userId: string, ctx: Context = {}): Promise<ShippingView> {
  const { db: q } = resolveContext(ctx);
  return shippingView(await findShipping(userId, q));
}

export interface CultureStock {
  id: string;
  title: string;
  status: string;
  kg_left: number;
  kg_held: number;
  estimated_count: number;
  species: string | null;
  ships: boolean;
  pickup: boolean;
  price_cents: number;
  /** Sold by the pack: the pack's weight (kg) and price. */
  pack: Pack | null;
  currency: string;
}

