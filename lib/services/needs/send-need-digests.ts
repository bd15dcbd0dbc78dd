import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { claimAlertsForMail, digestRecipients, lastDigestAt } from "@/db/need-alerts";
import { enqueueEmail } from "@/db/outbox";
import type { ListingRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import type { UnitSystem } from "@/lib/calc/units";
import { alertLine } from "@/lib/services/needs/steps/alert-line";
import { resolveContext, type Context } from "@/lib/context";

/** A person gets at most one digest in any this many hours (the "daily" of daily alerts). */
export const DIGEST_EVERY_HOURS = 24;

type PendingRow = Pick<ListingRow, "material_code" | "title" | "unit" | "quantity_total" | "quantity_held" | "quantity_collected" | "available_from"> & {
  id: string;
  distance_km: number;
  supplier: string;
  bed_name: string | null;
};

/**
 * Worker job: for everyone with daily alerts not yet e-mailed, one e-mail listing them all —
 * unless they had one in the last DIGEST_EVERY_HOURS, in which case they wait. The first
 * digest goes on the next run, so a new alert is never more than a day from its reader.
 */
export async function sendNeedDigests(ctx: Context = {}): Promise<number> {
  const { db: q, clock, signal } = resolveContext(ctx);
  const now = clock();
  const since = new Date(now.getTime() - DIGEST_EVERY_HOURS * 3_600_000).toISOString();
  let sent = 0;
  for (const userId of await digestRecipients(q)) {
    // A worker told to stop starts no new digest; the rest go on the next run.
    if (signal?.aborted) break;
    const last = await lastDigestAt(userId, q);
    if (last && last > since) continue;
    const person = await q("users").first("email", "display_name", "unit_system", "suspended_at", "email_verified_at").where({ id: userId });
    // An address nobody has confirmed gets no mail (anyone could have typed it): the notices wait in the app.
    if (!person || person.suspended_at || !person.email_verified_at) continue;
    const done = await writeTransaction(q, async (trx) => {
      const pending: PendingRow[] = await trx("need_alerts as a")
        .join("needs as n", "n.id", "a.need_id")
        .join("listings as l", "l.id", "a.listing_id")
        .join("users as s", "s.id", "l.owner_id")
        .leftJoin("beds as b", "b.id", "n.bed_id")
        .select("a.id", "a.distance_km", "l.material_code", "l.title", "l.unit", "l.quantity_total", "l.quantity_held", "l.quantity_collected", "l.available_from", "s.display_name as supplier", "b.name as bed_name")
        .where({ "a.user_id": userId, "a.delivery": "daily", "n.status": "open" })
        .whereNull("a.emailed_at")
        .whereNull("a.dismissed_at")
        .orderBy("a.created_at");
      if (!pending.length) return false;
      // Claimed first: another worker running the same job finds them taken and sends nothing.
      if ((await claimAlertsForMail(pending.map((p) => p.id), now.toISOString(), trx)) !== pending.length) throw new Error("taken by another worker");
      const lines = pending.map((p) => alertLine(p, p.supplier, p, p.bed_name, person.unit_system as UnitSystem, now));
      const data = { name: person.display_name, lines, needsUrl: `${appUrl()}/needs` };
      await enqueueEmail({ to: person.email, template: "need.digest", data, dedupe_key: `need-digest:${userId}:${pending[0].id}` }, trx);
      return true;
    }).catch((err: Error) => {
      if (err.message !== "taken by another worker") throw err;
      return false;
    });
    if (done) sent++;
  }
  return sent;
}
