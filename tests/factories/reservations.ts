import { db, newId, nowIso } from "@/db/index";
import type { ReservationRow } from "@/db/types";
import { defined } from "./defined";
import { createUser } from "./users";

export type ReservationOpts = Partial<Omit<ReservationRow, "listing_id">> & { listing_id: string };

const OPEN: ReservationRow["status"][] = ["held", "confirmed"];

/**
 * A reservation already in `status` (held by default) by a new gardener unless `gardener_id`
 * is given, with the listing's held and collected quantities moved to match. Confirmed,
 * closed and created at `updated_at` (now by default) unless those are given.
 */
export async function createReservation(opts: ReservationOpts) {
  const status = opts.status ?? "held";
  const gardener_id = opts.gardener_id ?? (await createUser({ roles: ["gardener"] })).id;
  const quantity = opts.quantity ?? 1;
  const at = opts.updated_at ?? nowIso();
  const id = opts.id ?? newId();
  const open = OPEN.includes(status);
  await db()("reservations").insert({
    payment_state: "none",
    hold_expires_at: status === "held" ? new Date(Date.now() + 30 * 60_000).toISOString() : null,
    pickup_code: status === "held" ? null : "ABC234",
    pickup_at: null,
    pickup_by: new Date(Date.now() + 3 * 86_400_000).toISOString(),
    amount_cents: 0,
    deposit_cents: 0,
    currency: "eur",
    confirmed_at: status === "held" ? null : at,
    closed_at: open ? null : at,
    created_at: at,
    ...defined(opts),
    id,
    gardener_id,
    quantity,
    status,
    updated_at: at,
  });
  if (open) await db()("listings").where({ id: opts.listing_id }).increment("quantity_held", quantity);
  if (status === "collected") await db()("listings").where({ id: opts.listing_id }).increment("quantity_collected", quantity);
  return { id, gardener_id };
}
