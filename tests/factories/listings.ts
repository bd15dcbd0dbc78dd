import type { Knex } from "knex";
import { db, newId, nowIso } from "@/db/index";
import type { ListingRow, PickupWindowRow } from "@/db/types";
import { MATERIALS } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import type { CandidateListing, LatLng } from "@/lib/match/types";
import { defined } from "./defined";
import { createUser } from "./users";

const seeded = new WeakSet<Knex>();

/** The materials table as lib/calc/facts.ts has it (listings point at it), once per database. */
async function ensureMaterials(q: Knex) {
  if (seeded.has(q)) return;
  for (const m of Object.values(MATERIALS)) {
    await q("materials")
      .insert({ code: m.code, name: m.name, n_pct: m.n_pct, cn_ratio: m.cn_ratio, moisture_pct: m.moisture_pct, bulk_density_kg_m3: m.bulk_density_kg_m3, default_unit: m.default_unit, source: m.source })
      .onConflict("code")
      .ignore();
  }
  seeded.add(q);
}

export type WindowOpts = Partial<Pick<PickupWindowRow, "weekday" | "start_time" | "end_time" | "starts_at" | "ends_at">> & { kind: "weekly" | "dated" };

/** Any listing column, plus its pickup windows; `quality` as an object. */
export type ListingOpts = Partial<Omit<ListingRow, "quality" | "material_code">> & {
  material_code?: string;
  quality?: Record<string, unknown>;
  /** Sets the exact and the public point at once (lat/lng and approx_lat/approx_lng win when given). */
  location?: LatLng;
  windows?: WindowOpts[];
};

const COUNTED = ["bags", "sheets", "bales"];

/**
 * An active listing written straight to the database (the listing forms have their own
 * tests): leaf bags in the demo town, 10 of them, free, owned by a new supplier unless
 * `owner_id` is given. Counted units get a unit size unless one is given.
 */
export async function createListing(opts: ListingOpts = {}) {
  const q = db();
  await ensureMaterials(q);
  const { windows = [], quality, location, ...columns } = opts;
  const owner_id = opts.owner_id ?? (await createUser({ roles: ["supplier"] })).id;
  const id = opts.id ?? newId();
  const now = nowIso();
  const material_code = opts.material_code ?? "leaves";
  const unit = opts.unit ?? "bags";
  await q("listings").insert({
    title: `Test ${material_code} ${id.slice(0, 4)}`,
    description: "",
    status: "active",
    unit_size: COUNTED.includes(unit) ? 0.07 : null,
    unit_mass_kg: null,
    quantity_total: 10,
    price_cents: 0,
    currency: "eur",
    deposit_cents: 0,
    max_per_reservation: null,
    auto_accept: false,
    lat: location?.lat ?? 52.2,
    lng: location?.lng ?? 0.85,
    address: `${id.slice(0, 3)} Secret Lane, Fernhollow`,
    approx_lat: location?.lat ?? 52.202,
    approx_lng: location?.lng ?? 0.852,
    quality: JSON.stringify(quality ?? {}),
    created_at: now,
    updated_at: now,
    ...defined(columns),
    id,
    owner_id,
    material_code,
    unit,
  });
  const window_ids: string[] = [];
  for (const w of windows) {
    const wid = newId();
    window_ids.push(wid);
    await q("pickup_windows").insert({ id: wid, listing_id: id, kind: w.kind, weekday: w.weekday ?? null, start_time: w.start_time ?? null, end_time: w.end_time ?? null, starts_at: w.starts_at ?? null, ends_at: w.ends_at ?? null });
  }
  return { id, owner_id, window_ids };
}

/** What a listing has in total, on hold and collected. */
export async function listingQuantities(id: string) {
  return db()("listings").first("quantity_total", "quantity_held", "quantity_collected").where({ id });
}

/** A valid POST /api/listings body (leaf bags near the demo town's centre), with overrides. */
export function listingBody(overrides: Record<string, unknown> = {}) {
  return {
    material: "leaves",
    title: "Bagged oak leaves",
    description: "Raked from the back lawn, dry, in paper sacks.",
    unit: "bags",
    quantity: 10,
    price_cents: 0,
    currency: "eur",
    deposit_cents: 0,
    location: { lat: 52.2051, lng: 0.8472 },
    address: "7 Test Lane, Fernhollow",
    quality: { leaf_source: "garden" },
    pickup_windows: [{ kind: "weekly", weekday: 6, start_time: "09:00", end_time: "12:00" }],
    ...overrides,
  };
}

/** A listing as matching sees it (no database), with its distance from `origin` filled in. */
export function candidateListing(origin: LatLng, l: Omit<CandidateListing, "distance_km" | "currency"> & { currency?: string }): CandidateListing {
  return { currency: "eur", ...l, distance_km: distanceKm(origin, l.location) };
}
