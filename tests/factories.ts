import { db, newId, nowIso } from "@/db/index";
import { setRole } from "@/db/users";
import type { Role } from "@/lib/auth/roles";

let n = 0;

/** A user with the given roles; a council user gets an organisation (or joins `orgId`). */
export async function createUser(opts: { roles?: Role[]; email?: string; orgId?: string; suspended?: boolean; password_hash?: string; unconfirmed?: boolean } = {}) {
  const id = newId();
  const now = nowIso();
  const email = opts.email ?? `user${++n}-${id.slice(0, 6)}@example.test`;
  await db()("users").insert({
    id,
    email,
    display_name: `Test person ${n}`,
    password_hash: opts.password_hash ?? null,
    // Confirmed unless asked otherwise: reserving and posting need a confirmed address.
    email_verified_at: opts.unconfirmed ? null : now,
    unit_system: "metric",
    reminders_opt_out: false,
    suspended_at: opts.suspended ? now : null,
    created_at: now,
    updated_at: now,
  });
  for (const role of opts.roles ?? ["gardener"]) await setRole(id, role, "active");
  let orgId = opts.orgId;
  if ((opts.roles ?? []).includes("council")) {
    if (!orgId) {
      orgId = newId();
      await db()("organisations").insert({ id: orgId, name: `Test council ${n}`, kind: "council", created_at: now });
    }
    await db()("memberships").insert({ organisation_id: orgId, user_id: id, org_role: opts.orgId ? "staff" : "owner", created_at: now });
  }
  return { id, email, orgId };
}

/** An active listing owned by `owner_id` (a council's when orgId is given). */
export async function createListing(opts: {
  owner_id: string;
  orgId?: string;
  material?: string;
  unit?: "sheets" | "m2" | "bags" | "m3" | "bales" | "kg";
  unit_size?: number | null;
  quantity_total?: number;
  status?: string;
  title?: string;
  quality?: Record<string, unknown>;
}) {
  const id = newId();
  const now = nowIso();
  await db()("listings").insert({
    id,
    owner_id: opts.owner_id,
    organisation_id: opts.orgId ?? null,
    material_code: opts.material ?? "leaves",
    title: opts.title ?? `Test listing ${++n}`,
    description: "",
    status: opts.status ?? "active",
    unit: opts.unit ?? "bags",
    unit_size: opts.unit_size === undefined ? null : opts.unit_size,
    quantity_total: opts.quantity_total ?? 20,
    lat: 52.2,
    lng: 0.85,
    address: "1 Test Lane",
    approx_lat: 52.203,
    approx_lng: 0.852,
    quality: JSON.stringify(opts.quality ?? {}),
    created_at: now,
    updated_at: now,
  });
  return { id };
}

/** A reservation row as the reservations feature leaves it (for reports that read them). */
export async function createReservation(opts: { listing_id: string; gardener_id: string; quantity: number; status: string; updated_at?: string; closed_at?: string }) {
  const id = newId();
  const at = opts.updated_at ?? nowIso();
  await db()("reservations").insert({ id, listing_id: opts.listing_id, gardener_id: opts.gardener_id, quantity: opts.quantity, status: opts.status, created_at: at, updated_at: at, closed_at: opts.closed_at ?? null });
  return { id };
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
