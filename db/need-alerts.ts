import { db, type Db } from "./index";
import type { NeedAlertRow } from "./types";

/** Needs (of these) already alerted about a listing: an alert is sent once per need and listing. */
export async function alertedNeeds(listingId: string, needIds: readonly string[], q: Db = db()): Promise<Set<string>> {
  const out = new Set<string>();
  // Chunked: SQLite takes at most 32,766 bound values in one statement.
  for (let i = 0; i < needIds.length; i += 5_000) {
    const ids: string[] = await q("need_alerts").where("listing_id", listingId).whereIn("need_id", needIds.slice(i, i + 5_000)).pluck("need_id");
    for (const id of ids) out.add(id);
  }
  return out;
}

/** Writes alerts; one already there for the same need and listing is kept as it was. */
export async function insertAlerts(rows: NeedAlertRow[], q: Db = db()): Promise<void> {
  for (let i = 0; i < rows.length; i += 500) {
    await q("need_alerts").insert(rows.slice(i, i + 500)).onConflict(["need_id", "listing_id"]).ignore();
  }
}

/** How many different gardeners' needs a listing has been matched to. */
export async function matchedGardeners(listingId: string, q: Db = db()): Promise<number> {
  const [{ n }] = await q("need_alerts").where("listing_id", listingId).countDistinct({ n: "user_id" });
  return Number(n);
}

/** Alerts a person has not looked at yet (the count beside "My needs"). */
export async function unseenAlerts(userId: string, q: Db = db()): Promise<number> {
  const [{ n }] = await q("need_alerts as a")
    .join("needs as n", "n.id", "a.need_id")
    .where({ "a.user_id": userId, "n.status": "open" })
    .whereNull("a.seen_at")
    .whereNull("a.dismissed_at")
    .count({ n: "*" });
  return Number(n);
}

export async function markAlertsSeen(userId: string, ids: readonly string[], now: string, q: Db = db()): Promise<void> {
  if (!ids.length) return;
  await q("need_alerts").where("user_id", userId).whereIn("id", [...ids]).whereNull("seen_at").update({ seen_at: now });
}

export async function dismissAlert(userId: string, id: string, now: string, q: Db = db()): Promise<boolean> {
  return (await q("need_alerts").where({ user_id: userId, id }).update({ dismissed_at: now, seen_at: q.raw("coalesce(seen_at, ?)", [now]) })) === 1;
}

/** People with daily alerts not yet e-mailed, on needs still open. */
export async function digestRecipients(q: Db = db()): Promise<string[]> {
  return q("need_alerts as a")
    .join("needs as n", "n.id", "a.need_id")
    .where("a.delivery", "daily")
    .whereNull("a.emailed_at")
    .whereNull("a.dismissed_at")
    .andWhere("n.status", "open")
    .distinct("a.user_id")
    .pluck("a.user_id");
}

/** When a person was last sent a digest (the newest e-mailed daily alert), or null. */
export async function lastDigestAt(userId: string, q: Db = db()): Promise<string | null> {
  const row = await q("need_alerts").where({ user_id: userId, delivery: "daily" }).whereNotNull("emailed_at").max({ at: "emailed_at" }).first();
  return (row?.at as string | null | undefined) ?? null;
}

/** Claims alerts for an e-mail: only those still un-mailed are marked, so two workers cannot both send them. */
export async function claimAlertsForMail(ids: readonly string[], now: string, q: Db = db()): Promise<number> {
  if (!ids.length) return 0;
  return q("need_alerts").whereIn("id", [...ids]).whereNull("emailed_at").update({ emailed_at: now });
}
