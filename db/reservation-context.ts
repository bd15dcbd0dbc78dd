import { db, type Db } from "./index";
import type { ReservationRow } from "./types";
import { pickupWindowsOf } from "./reservations";
import type { PickupWindowRow } from "./types";

/** A reservation with what its pages and e-mails need about the listing and both people. */
export interface ReservationContext extends ReservationRow {
  listing: {
    id: string;
    title: string;
    material_code: string;
    unit: string;
    unit_size: number | null;
    unit_mass_kg: number | null;
    auto_accept: boolean;
    owner_id: string;
    organisation_id: string | null;
    // Private: shown only to the owner and to the gardener once confirmed.
    address: string;
    lat: number;
    lng: number;
    approx_lat: number;
    approx_lng: number;
  };
  gardener: { id: string; name: string; email: string; reminders_opt_out: boolean };
  supplier: { id: string; name: string; email: string; verified: boolean };
  window: PickupWindowRow | null;
}

export async function reservationContexts(ids: string[], q: Db = db()): Promise<ReservationContext[]> {
  if (ids.length === 0) return [];
  const rows = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .join("users as g", "g.id", "r.gardener_id")
    .join("users as s", "s.id", "l.owner_id")
    .select(
      "r.*",
      "l.title as l_title",
      "l.material_code as l_material_code",
      "l.unit as l_unit",
      "l.unit_size as l_unit_size",
      "l.unit_mass_kg as l_unit_mass_kg",
      "l.auto_accept as l_auto_accept",
      "l.owner_id as l_owner_id",
      "l.organisation_id as l_organisation_id",
      "l.address as l_address",
      "l.lat as l_lat",
      "l.lng as l_lng",
      "l.approx_lat as l_approx_lat",
      "l.approx_lng as l_approx_lng",
      "g.display_name as g_name",
      "g.email as g_email",
      "g.reminders_opt_out as g_reminders_opt_out",
      "s.display_name as s_name",
      "s.email as s_email",
      "s.verified_at as s_verified_at",
    )
    .whereIn("r.id", ids);
  const windowIds = rows.map((r: { pickup_window_id: string | null }) => r.pickup_window_id).filter(Boolean);
  const windows = windowIds.length
    ? await pickupWindowsOf([...new Set(rows.map((r: { listing_id: string }) => r.listing_id))] as string[], q)
    : [];
  const byId = new Map(rows.map((r: Record<string, unknown>) => [r.id as string, r]));
  return ids.filter((id) => byId.has(id)).map((id) => {
    const r = byId.get(id) as Record<string, any>;
    const out: Record<string, any> = {};
    for (const [k, v] of Object.entries(r)) if (!/^[lgs]_/.test(k)) out[k] = v;
    return {
      ...(out as ReservationRow),
      listing: {
        id: r.listing_id,
        title: r.l_title,
        material_code: r.l_material_code,
        unit: r.l_unit,
        unit_size: r.l_unit_size,
        unit_mass_kg: r.l_unit_mass_kg,
        auto_accept: Boolean(r.l_auto_accept),
        owner_id: r.l_owner_id,
        organisation_id: r.l_organisation_id,
        address: r.l_address,
        lat: r.l_lat,
        lng: r.l_lng,
        approx_lat: r.l_approx_lat,
        approx_lng: r.l_approx_lng,
      },
      gardener: { id: r.gardener_id, name: r.g_name, email: r.g_email, reminders_opt_out: Boolean(r.g_reminders_opt_out) },
      supplier: { id: r.l_owner_id, name: r.s_name, email: r.s_email, verified: Boolean(r.s_verified_at) },
      window: windows.find((w) => w.id === r.pickup_window_id) ?? null,
    };
  });
}

export async function reservationContext(id: string, q: Db = db()): Promise<ReservationContext | undefined> {
  return (await reservationContexts([id], q))[0];
}
