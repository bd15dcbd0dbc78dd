// Listings and reservations for the reservation tests, written straight to the database
// (the listing forms belong to another part of the app).
import { db, newId, nowIso } from "@/db/index";
import { MATERIALS } from "@/lib/calc/facts";
import type { ReservationRow } from "@/db/types";
import { createUser } from "./factories";

async function ensureMaterials() {
  for (const m of Object.values(MATERIALS)) {
    await db()("materials")
      .insert({ code: m.code, name: m.name, n_pct: m.n_pct, cn_ratio: m.cn_ratio, moisture_pct: m.moisture_pct, bulk_density_kg_m3: m.bulk_density_kg_m3, default_unit: m.default_unit, source: m.source })
      .onConflict("code")
      .ignore();
  }
}

export interface ListingOpts {
  ownerId?: string;
  organisationId?: string | null;
  material?: string;
  unit?: string;
  quantity_total?: number;
  price_cents?: number;
  deposit_cents?: number;
  max_per_reservation?: number | null;
  auto_accept?: boolean;
  status?: string;
  address?: string;
  windows?: { kind: "weekly" | "dated"; weekday?: number; start_time?: string; end_time?: string; starts_at?: string; ends_at?: string }[];
}

export async function createListing(opts: ListingOpts = {}) {
  await ensureMaterials();
  const ownerId = opts.ownerId ?? (await createUser({ roles: ["supplier"] })).id;
  const id = newId();
  const now = nowIso();
  await db()("listings").insert({
    id,
    owner_id: ownerId,
    organisation_id: opts.organisationId ?? null,
    material_code: opts.material ?? "leaves",
    title: `Test ${opts.material ?? "leaves"} ${id.slice(0, 4)}`,
    description: "",
    status: opts.status ?? "active",
    unit: opts.unit ?? "bags",
    unit_size: 0.07,
    unit_mass_kg: null,
    quantity_total: opts.quantity_total ?? 10,
    price_cents: opts.price_cents ?? 0,
    currency: "eur",
    deposit_cents: opts.deposit_cents ?? 0,
    max_per_reservation: opts.max_per_reservation ?? null,
    auto_accept: opts.auto_accept ?? false,
    lat: 52.2,
    lng: 0.85,
    address: opts.address ?? `${id.slice(0, 3)} Secret Lane, Fernhollow`,
    approx_lat: 52.202,
    approx_lng: 0.852,
    created_at: now,
    updated_at: now,
  });
  const windowIds: string[] = [];
  for (const w of opts.windows ?? []) {
    const wid = newId();
    windowIds.push(wid);
    await db()("pickup_windows").insert({ id: wid, listing_id: id, kind: w.kind, weekday: w.weekday ?? null, start_time: w.start_time ?? null, end_time: w.end_time ?? null, starts_at: w.starts_at ?? null, ends_at: w.ends_at ?? null });
  }
  return { id, ownerId, windowIds };
}

/** A reservation already in `status`, with the listing's held/collected quantities to match. */
export async function createReservationIn(status: ReservationRow["status"], opts: { listingId: string; gardenerId?: string; quantity?: number; payment_state?: ReservationRow["payment_state"]; pickup_by?: string | null; pickup_at?: string | null; hold_expires_at?: string | null }) {
  const gardenerId = opts.gardenerId ?? (await createUser({ roles: ["gardener"] })).id;
  const quantity = opts.quantity ?? 1;
  const now = nowIso();
  const id = newId();
  const open = status === "held" || status === "confirmed";
  await db()("reservations").insert({
    id,
    listing_id: opts.listingId,
    gardener_id: gardenerId,
    quantity,
    status,
    payment_state: opts.payment_state ?? "none",
    hold_expires_at: opts.hold_expires_at ?? (status === "held" ? new Date(Date.now() + 30 * 60_000).toISOString() : null),
    pickup_code: status === "held" ? null : "ABC234",
    pickup_at: opts.pickup_at ?? null,
    pickup_by: opts.pickup_by === undefined ? new Date(Date.now() + 3 * 86_400_000).toISOString() : opts.pickup_by,
    amount_cents: 0,
    deposit_cents: 0,
    currency: "eur",
    confirmed_at: status === "held" ? null : now,
    closed_at: open ? null : now,
    created_at: now,
    updated_at: now,
  });
  if (open) await db()("listings").where({ id: opts.listingId }).increment("quantity_held", quantity);
  if (status === "collected") await db()("listings").where({ id: opts.listingId }).increment("quantity_collected", quantity);
  return { id, gardenerId };
}

export async function listingQuantities(id: string) {
  return db()("listings").first("quantity_total", "quantity_held", "quantity_collected").where({ id });
}
