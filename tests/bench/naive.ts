// The baseline the benchmark compares against: read every listing, measure the distance to
// each with Turf, keep what is reservable and in range.
import type { Knex } from "knex";
import type { MaterialCode } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import type { CandidateListing, LatLng } from "@/lib/match/types";

export async function naiveCandidates(k: Knex, origin: LatLng, radius_km: number, materials: readonly MaterialCode[], now = new Date()): Promise<CandidateListing[]> {
  const rows = await k("listings").select("*");
  const wanted = new Set(materials);
  const iso = now.toISOString();
  const out: CandidateListing[] = [];
  for (const r of rows) {
    const location = { lat: r.approx_lat, lng: r.approx_lng };
    const distance_km = distanceKm(origin, location);
    const available = r.quantity_total - r.quantity_held - r.quantity_collected;
    if (distance_km > radius_km || r.status !== "active" || !wanted.has(r.material_code) || available <= 1e-9) continue;
    if (r.available_until && r.available_until <= iso) continue;
    out.push({
      id: r.id, material: r.material_code, unit: r.unit, unit_size: r.unit_size, unit_mass_kg: r.unit_mass_kg, available,
      max_per_reservation: r.max_per_reservation, price_cents: r.price_cents, currency: r.currency, location, distance_km,
    });
  }
  return out;
}

export async function naiveNearest(k: Knex, origin: LatLng, radius_km: number, materials: readonly MaterialCode[], limit: number) {
  return (await naiveCandidates(k, origin, radius_km, materials)).sort((a, b) => a.distance_km - b.distance_km).slice(0, limit);
}
