import type { Knex } from "knex";
import type { MaterialCode } from "../lib/calc/facts";
import { distanceKm } from "../lib/match/geo";
import { cellOf } from "../lib/needs/grid";
import { reachBand } from "../lib/needs/reach";
import { seedId } from "./ids";
import { demoListings } from "./listings";
import { approximatePoint, placeOwner } from "../lib/geo/approximate";
import { TOWN } from "./town";

// Open needs around Fernhollow, so the council's demand map and its giveaway-day suggestion
// have something to show: leaves and compost wanted around Lantern Hill, leaves in Little
// Sedge, wood chips in Hartwell — each area with three or more households, as the map
// requires — and two households alone in their areas, whom the map leaves out. Ines, the demo
// gardener, waits for compost, and one listing has already been found for her. Fixed ids and
// "insert or ignore", like the rest of the demo.

const CREATED = "2026-11-28T18:00:00.000Z";
const KM_LAT = 1 / 111.2;
const KM_LNG = 1 / (111.2 * Math.cos((TOWN.centre.lat * Math.PI) / 180));
/** A cell's centre `x`, `y` km east and north of the town centre. */
const area = (x: number, y: number) => cellOf(TOWN.centre.lat + y * KM_LAT, TOWN.centre.lng + x * KM_LNG).centre;

const LANTERN_HILL = area(-0.9, 0.8);
const LITTLE_SEDGE = area(-4.8, 3.2);
const HARTWELL = area(4.6, -3.9);
const OAKHURST = area(3.8, 4.4);

interface SeedNeed {
  who: string;
  material: MaterialCode;
  quantity: number;
  unit: "m2" | "m3" | "kg";
  /** Metres east and north of its area's centre: a few hundred, so each stays inside its cell. */
  at: [typeof LANTERN_HILL, number, number];
  radius_km: number;
  needed_by: string;
}

const NEEDS: SeedNeed[] = [
  { who: "maeve", material: "leaves", quantity: 0.9, unit: "m3", at: [LANTERN_HILL, -250, 120], radius_km: 5, needed_by: "2027-03-20" },
  { who: "tobias", material: "leaves", quantity: 1.4, unit: "m3", at: [LANTERN_HILL, 180, -200], radius_km: 10, needed_by: "2027-04-03" },
  { who: "hazel", material: "leaves", quantity: 0.5, unit: "m3", at: [LANTERN_HILL, 320, 260], radius_km: 5, needed_by: "2027-03-06" },
  { who: "idris", material: "leaves", quantity: 0.7, unit: "m3", at: [LANTERN_HILL, -90, -330], radius_km: 8, needed_by: "2027-04-17" },
  { who: "hazel", material: "compost", quantity: 0.3, unit: "m3", at: [LANTERN_HILL, 320, 260], radius_km: 5, needed_by: "2027-04-10" },
  { who: "idris", material: "compost", quantity: 0.4, unit: "m3", at: [LANTERN_HILL, -90, -330], radius_km: 8, needed_by: "2027-04-24" },
  { who: "tobias", material: "compost", quantity: 0.25, unit: "m3", at: [LANTERN_HILL, 180, -200], radius_km: 10, needed_by: "2027-05-01" },
  { who: "juno", material: "leaves", quantity: 0.6, unit: "m3", at: [LITTLE_SEDGE, -150, 100], radius_km: 6, needed_by: "2027-03-13" },
  { who: "kit", material: "leaves", quantity: 1.1, unit: "m3", at: [LITTLE_SEDGE, 200, -180], radius_km: 10, needed_by: "2027-03-27" },
  { who: "lorna", material: "leaves", quantity: 0.8, unit: "m3", at: [LITTLE_SEDGE, 60, 300], radius_km: 8, needed_by: "2027-04-10" },
  { who: "nico", material: "wood_chips", quantity: 1.5, unit: "m3", at: [HARTWELL, -200, 150], radius_km: 10, needed_by: "2027-02-27" },
  { who: "oona", material: "wood_chips", quantity: 2, unit: "m3", at: [HARTWELL, 250, -100], radius_km: 10, needed_by: "2027-03-13" },
  { who: "pim", material: "wood_chips", quantity: 1, unit: "m3", at: [HARTWELL, 40, 320], radius_km: 15, needed_by: "2027-03-27" },
  // Alone in their areas: the council's map leaves them out.
  { who: "priya", material: "leaves", quantity: 0.45, unit: "m3", at: [OAKHURST, 100, 100], radius_km: 5, needed_by: "2027-03-20" },
  { who: "gardener", material: "compost", quantity: 0.3, unit: "m3", at: [area(0.4, 0.4), 0, 0], radius_km: 10, needed_by: "2027-04-15" },
];

function placeOf(n: SeedNeed) {
  const [centre, east, north] = n.at;
  return { lat: Math.round((centre.lat + (north / 1000) * KM_LAT) * 1e6) / 1e6, lng: Math.round((centre.lng + (east / 1000) * KM_LNG) * 1e6) / 1e6 };
}

export async function seedNeeds(trx: Knex.Transaction | Knex): Promise<void> {
  for (const [i, n] of NEEDS.entries()) {
    const place = placeOf(n);
    await trx("needs")
      .insert({
        id: seedId(`need:${n.who}:${n.material}:${i}`),
        owner_id: seedId(`user:${n.who}`),
        bed_id: null,
        material_code: n.material,
        quantity: n.quantity,
        unit: n.unit,
        radius_km: n.radius_km,
        reach_km: reachBand(n.radius_km),
        lat: place.lat,
        lng: place.lng,
        needed_by: n.needed_by,
        alerts: "daily",
        status: "open",
        closed_at: null,
        created_at: CREATED,
        updated_at: CREATED,
      })
      .onConflict("id")
      .ignore();
  }

  // Ines's compost need has been matched to the council's sieved compost, already e-mailed
  // in a digest: her needs page shows it as new, and the council's listing counts her.
  const ines = NEEDS.findIndex((n) => n.who === "gardener");
  const compost = demoListings().find((l) => l.material === "compost");
  if (compost) {
    const approx = approximatePoint({ owner: placeOwner({ organisation_id: compost.org ? seedId(`org:${compost.org}`) : null, owner_id: seedId(`user:${compost.owner}`) }), lat: compost.lat, lng: compost.lng });
    await trx("need_alerts")
      .insert({
        id: seedId("need-alert:ines-compost"),
        need_id: seedId(`need:gardener:compost:${ines}`),
        listing_id: seedId(compost.key),
        user_id: seedId("user:gardener"),
        distance_km: Math.round(distanceKm(placeOf(NEEDS[ines]), approx) * 1000) / 1000,
        delivery: "daily",
        emailed_at: CREATED,
        seen_at: null,
        dismissed_at: null,
        created_at: CREATED,
      })
      .onConflict("id")
      .ignore();
  }
}
