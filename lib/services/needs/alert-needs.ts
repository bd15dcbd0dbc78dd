import "server-only";
import type { Knex } from "knex";
import { newId } from "@/db/index";
import { findListing } from "@/db/listings";
import { alertedNeeds, insertAlerts, matchedGardeners } from "@/db/need-alerts";
import { enqueueEmails, type NewEmail } from "@/db/outbox";
import type { ListingRow, NeedAlertRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { listingCautions } from "@/lib/calc/cautions";
import { datesState, quantityLeft } from "@/lib/listings/status";
import { formatDay, formatListingQuantity, materialName } from "@/lib/listings/format";
import type { AlertLine } from "@/lib/mail/templates/need-alerts";
import type { ListingUnit } from "@/lib/match/types";
import { needsReaching, type AlertingListing, type ReachedNeed } from "@/lib/needs/reaching";
import { DUE_NOW } from "@/migrations/20261208_020_open_needs";
import { resolveContext, type Context } from "@/lib/services/context";
import { dayOf } from "@/lib/services/needs/context";

// When a listing is posted, restocked or comes into its dates, every open need it could
// serve gets one alert: an in-app notice (the need_alerts row) and an e-mail through the
// outbox, at once or in the day's digest as the gardener chose. An alert is unique per need
// and listing, so checking a listing again (every restock, every returned hold) only reaches
// needs it has not reached before.

/** A listing as it stands for alerts: whether it can serve anyone now, and from which day. */
export function alertingListing(l: ListingRow, now: Date): AlertingListing | null {
  if (l.status !== "active" || quantityLeft(l) <= 0) return null;
  const dates = datesState(l, now);
  if (dates === "ended") return null;
  const from_day = dates === "not_yet" && l.available_from ? dayOf(new Date(l.available_from)) : dayOf(now);
  return {
    id: l.id,
    owner_id: l.owner_id,
    material: l.material_code,
    unit: l.unit as ListingUnit,
    unit_size: l.unit_size === null ? null : Number(l.unit_size),
    unit_mass_kg: l.unit_mass_kg === null ? null : Number(l.unit_mass_kg),
    location: { lat: Number(l.approx_lat), lng: Number(l.approx_lng) },
    from_day,
  };
}

/** When the listing should be looked at again: on its start date if that is still to come. */
function nextDue(l: ListingRow, now: Date): string | null {
  return l.status === "active" && l.available_from && Date.parse(l.available_from) > now.getTime() ? new Date(l.available_from).toISOString() : null;
}

interface Recipient {
  id: string;
  email: string;
  display_name: string;
  unit_system: UnitSystem;
  suspended_at: string | null;
  email_verified_at: string | null;
}

/** The words of one alert for its reader. */
export function alertLine(
  l: Pick<ListingRow, "material_code" | "title" | "unit" | "quantity_total" | "quantity_held" | "quantity_collected" | "available_from">,
  supplier: string,
  alert: { id: string; distance_km: number },
  bedName: string | null,
  system: UnitSystem,
  now: Date,
): AlertLine {
  return {
    material: materialName(l.material_code),
    listingTitle: l.title,
    supplier,
    distance: formatQuantity(Math.max(0.1, alert.distance_km), "km", system),
    forWhat: bedName ? `for ${bedName}` : "",
    left: `${formatListingQuantity(quantityLeft(l), l.unit as ListingUnit, system)} left`,
    from: l.available_from && Date.parse(l.available_from) > now.getTime() ? `from ${formatDay(l.available_from)}` : "",
    url: `${appUrl()}/needs/alerts/${alert.id}`,
  };
}

/** The cautions an alert e-mail carries: the material's own, without the general lines. */
export function alertCautions(l: Pick<ListingRow, "material_code" | "unit" | "unit_mass_kg" | "quality">): string[] {
  // A listing saved before a declaration existed reads as none: the general caution still applies.
  return listingCautions({ material: l.material_code, unit: l.unit, unit_mass_kg: l.unit_mass_kg === null ? null : Number(l.unit_mass_kg), quality: l.quality })
    .filter((c) => c.kind !== "gloves")
    .map((c) => c.text);
}

async function writeAlerts(trx: Knex.Transaction, l: ListingRow, fresh: ReachedNeed[], now: Date): Promise<void> {
  const at = now.toISOString();
  const rows: NeedAlertRow[] = fresh.map((f) => ({
    id: newId(),
    need_id: f.need.id,
    listing_id: l.id,
    user_id: f.need.owner_id,
    distance_km: Math.round(f.distance_km * 1000) / 1000,
    delivery: f.need.alerts,
    // "At once" alerts are e-mailed in this same transaction, so the digest never carries them.
    emailed_at: f.need.alerts === "immediate" ? at : null,
    seen_at: null,
    dismissed_at: null,
    created_at: at,
  }));
  await insertAlerts(rows, trx);
  const immediate = rows.filter((r) => r.delivery === "immediate");
  if (!immediate.length) return;

  const people = new Map<string, Recipient>();
  const ids = [...new Set(immediate.map((r) => r.user_id))];
  for (let i = 0; i < ids.length; i += 5_000) {
    for (const u of (await trx("users").select("id", "email", "display_name", "unit_system", "suspended_at", "email_verified_at").whereIn("id", ids.slice(i, i + 5_000))) as Recipient[]) people.set(u.id, u);
  }
  const bedOf = new Map(fresh.map((f) => [f.need.id, f.need.bed_id]));
  const bedIds = [...new Set(fresh.map((f) => f.need.bed_id).filter((b): b is string => !!b))];
  const beds = new Map<string, string>(bedIds.length ? ((await trx("beds").select("id", "name").whereIn("id", bedIds)) as { id: string; name: string }[]).map((b) => [b.id, b.name]) : []);
  const supplier = (await trx("users").first("display_name").where({ id: l.owner_id }))?.display_name ?? "A supplier";
  const cautions = alertCautions(l);
  const mails: NewEmail[] = [];
  for (const r of immediate) {
    const person = people.get(r.user_id);
    // An address nobody has confirmed gets no mail: the notice waits in the app.
    if (!person || person.suspended_at || !person.email_verified_at) continue;
    const bed = bedOf.get(r.need_id);
    const line = alertLine(l, supplier, r, bed ? (beds.get(bed) ?? null) : null, person.unit_system, now);
    const data = { name: person.display_name, line, cautions, needsUrl: `${appUrl()}/needs` };
    mails.push({ to: person.email, template: "need.alert", data, dedupe_key: `need-alert:${r.need_id}:${l.id}` });
  }
  await enqueueEmails(mails, trx);
}

export interface FanOut {
  /** New alerts written by this run. */
  alerted: number;
  /** Different gardeners the listing has been matched to, this run and before. */
  matched_gardeners: number;
}

/**
 * Checks one listing against the open needs and alerts every need it could serve that it has
 * not alerted before. The listing's due mark is taken first, so a change that lands while
 * this runs marks it due again and is looked at on the next run.
 */
export async function alertNeedsFor(listingId: string, ctx: Context = {}): Promise<FanOut> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const l = await findListing(listingId, q);
  if (!l) return { alerted: 0, matched_gardeners: 0 };
  const due = (await q("listings").first("needs_due_at").where({ id: l.id }))?.needs_due_at ?? null;
  const next = nextDue(l, now);
  const claim = q("listings").where({ id: l.id });
  await (due === null ? claim.whereNull("needs_due_at") : claim.where("needs_due_at", due)).update({ needs_due_at: next });

  let alerted = 0;
  try {
    const alerting = alertingListing(l, now);
    if (alerting) {
      const found = await needsReaching(alerting, q);
      const before = await alertedNeeds(l.id, found.map((f) => f.need.id), q);
      const fresh = found.filter((f) => !before.has(f.need.id));
      if (fresh.length) await q.transaction((trx) => writeAlerts(trx, l, fresh, now));
      alerted = fresh.length;
    }
  } catch (err) {
    // Due again, so the worker tries once more; the alerts are unique, so nothing doubles.
    await q("listings").where({ id: l.id }).update({ needs_due_at: DUE_NOW });
    throw err;
  }
  return { alerted, matched_gardeners: await matchedGardeners(l.id, q) };
}

/** After a service changed a listing: alert at once if the change made it due (the worker is the safety net). */
export async function alertIfDue(listingId: string, ctx: Context = {}): Promise<void> {
  const { db: q, clock } = resolveContext(ctx);
  const row = await q("listings").first("needs_due_at").where({ id: listingId });
  if (!row?.needs_due_at || new Date(row.needs_due_at).getTime() > clock().getTime()) return;
  try {
    await alertNeedsFor(listingId, { db: q, clock });
  } catch (err) {
    console.error(`[needs] alerts for listing ${listingId} left to the worker:`, (err as Error).message);
  }
}

/** Worker job: every listing whose check is due (posted, restocked, changed, or come into its dates). */
export async function alertDueListings(ctx: Context = {}): Promise<{ listings: number; alerted: number }> {
  const { db: q, clock, signal } = resolveContext(ctx);
  const now = clock();
  const ids: string[] = await q("listings").whereNotNull("needs_due_at").andWhere("needs_due_at", "<=", now.toISOString()).orderBy("needs_due_at").limit(50).pluck("id");
  let alerted = 0;
  for (const id of ids) {
    // A worker told to stop takes no new listing; the rest stay due for the next one.
    if (signal?.aborted) break;
    try {
      alerted += (await alertNeedsFor(id, { db: q, clock })).alerted;
    } catch (err) {
      console.error(`[needs] alerts for listing ${id} failed:`, (err as Error).message);
    }
  }
  return { listings: ids.length, alerted };
}
