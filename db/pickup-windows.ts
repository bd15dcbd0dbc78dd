import { db, groupBy, newId, type Db } from "./index";
import type { PickupWindowRow } from "./types";

const WINDOW_COLUMNS = ["id", "listing_id", "kind", "weekday", "start_time", "end_time", "starts_at", "ends_at"];

export async function windowsFor(listingIds: string[], q: Db = db()): Promise<Map<string, PickupWindowRow[]>> {
  if (listingIds.length === 0) return new Map();
  const rows = (await q("pickup_windows")
    .select(WINDOW_COLUMNS)
    .whereIn("listing_id", [...new Set(listingIds)])
    .orderBy([{ column: "kind", order: "desc" }, { column: "weekday" }, { column: "start_time" }, { column: "starts_at" }])) as PickupWindowRow[];
  return groupBy(rows, (r) => r.listing_id);
}

const sameWindow = (a: Omit<PickupWindowRow, "id">, b: Omit<PickupWindowRow, "id">) =>
  a.kind === b.kind && a.weekday === b.weekday && a.start_time === b.start_time && a.end_time === b.end_time && a.starts_at === b.starts_at && a.ends_at === b.ends_at;

/**
 * Makes the listing's windows exactly `windows`. A window that is unchanged keeps its row
 * (and so its id), so reservations that point at it keep their pickup time.
 */
/** Window fields without id or listing (lib/listings/windows.ts makes them from the form's input). */
export type PickupWindowFields = Omit<PickupWindowRow, "id" | "listing_id">;

export async function replaceWindows(listingId: string, windows: PickupWindowFields[], q: Db = db()): Promise<void> {
  const wanted: Omit<PickupWindowRow, "id">[] = windows.map((w) => ({ ...w, listing_id: listingId }));
  const existing = (await q("pickup_windows").select(WINDOW_COLUMNS).where({ listing_id: listingId })) as PickupWindowRow[];
  const keep = new Set<string>();
  const toInsert: Omit<PickupWindowRow, "id">[] = [];
  for (const w of wanted) {
    const match = existing.find((e) => !keep.has(e.id) && sameWindow(e, w));
    if (match) keep.add(match.id);
    else toInsert.push(w);
  }
  const drop = existing.filter((e) => !keep.has(e.id)).map((e) => e.id);
  if (drop.length) await q("pickup_windows").whereIn("id", drop).delete();
  if (toInsert.length) await q("pickup_windows").insert(toInsert.map((w) => ({ id: newId(), ...w })));
}
