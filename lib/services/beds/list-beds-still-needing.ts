import "server-only";
import type { MaterialCode } from "@/lib/calc/facts";
import { needPerListingUnit } from "@/lib/match/units";
import type { ListingUnit, Need } from "@/lib/match/types";
import { bedNeeds } from "@/lib/beds/needs";
import { listBeds, reservedForBeds } from "@/db/beds";
import { resolveContext, type Context } from "@/lib/context";

export interface BedStillNeeds {
  id: string;
  name: string;
  point: { lat: number; lng: number } | null;
  /** Each of the bed's needs less what is already reserved towards it; nothing below zero. */
  needs: (Need & { total: number })[];
}

/**
 * What each of a gardener's beds still needs: its own estimate less what reservations made
 * for it (held, confirmed or collected) already bring. Browse's "for my bed" view reads this.
 */
export async function bedsStillNeed(ownerId: string, ctx: Context = {}): Promise<BedStillNeeds[]> {
  const { db: q } = resolveContext(ctx);
  const beds = await listBeds(ownerId, q);
  const reserved = await reservedForBeds(beds.map((b) => b.id), q);
  const out: BedStillNeeds[] = [];
  for (const bed of beds) {
    let needs: Need[];
    try {
      needs = bedNeeds(bed);
    } catch {
      continue; // a bed whose saved shape cannot be read is left out here; its own page says why
    }
    const mine = reserved.filter((r) => r.bed_id === bed.id);
    out.push({
      id: bed.id,
      name: bed.name,
      point: bed.lat === null || bed.lng === null ? null : { lat: Number(bed.lat), lng: Number(bed.lng) },
      needs: needs.map((n) => {
        const brought = mine
          .filter((r) => r.material === n.material)
          .reduce((sum, r) => {
            const per = needPerListingUnit({ material: r.material as MaterialCode, unit: r.unit as ListingUnit, unit_size: r.unit_size, unit_mass_kg: r.unit_mass_kg }, n.unit);
            return sum + (per ?? 0) * Number(r.quantity);
          }, 0);
        return { ...n, total: n.quantity, quantity: Math.max(0, n.quantity - brought) };
      }),
    });
  }
  return out;
}
