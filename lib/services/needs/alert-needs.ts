import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import type { Knex } from "knex";
import { newId } from "@/db/index";
import { findListing } from "@/db/listings";
import { alertedNeeds, insertAlerts, matchedGardeners } from "@/db/need-alerts";
import { enqueueEmails, type NewEmail } from "@/db/outbox";
import type { ListingRow, NeedAlertRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import type { UnitSystem } from "@/lib/calc/units";
import { needsReaching, type ReachedNeed } from "@/lib/needs/reaching";
import { DUE_NOW } from "@/migrations/20261208_020_open_needs";
import { resolveContext, type Context } from "@/lib/context";
import { alertCautions } from "@/lib/services/needs/steps/alert-cautions";
import { alertLine } from "@/lib/services/needs/steps/alert-line";
import { alertingListing } from "@/lib/services/needs/steps/alerting-listing";

// When a listing is posted, restocked or comes into its dates, every open need it could
// serve gets one alert: an in-app notice (the need_alerts row) and an e-mail through the
// outbox, at once or in the day's digest as the gardener chose. An alert is unique per need
// and listing, so checking a listing again (every restock, every returned hold) only reaches
// needs it has not reached before.

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
      if (fresh.length) await writeTransaction(q, (trx) => writeAlerts(trx, l, fresh, now));
      alerted = fresh.length;
    }
  } catch (err) {
    // Due again, so the worker tries once more; the alerts are unique, so nothing doubles.
    await q("listings").where({ id: l.id }).update({ needs_due_at: DUE_NOW });
    throw err;
  }
  return { alerted, matched_gardeners: await matchedGardeners(l.id, q) };
}
