// The demo town twenty times over, for timing the signed-in pages with a busy year's data:
// every listing, pickup window, bed, need, reservation (with its events and reviews), alert,
// giveaway day, slot and booking is copied nineteen more times under new ids, for the same
// demo people, so each of them has twenty times as much on their pages. Copies keep every
// reference inside their own copy (a copied reservation points at the copied listing and
// window), so the database's own checks and triggers (held quantities, booked slots, the
// listings' spatial and text indexes) hold as they do for the demo. SQLite only.
import type { Knex } from "knex";
import { seedId } from "@/seeds/ids";

/** Copied in this order: each table's references to earlier ones are moved to the copy. */
const TABLES = [
  "listings",
  "pickup_windows",
  "beds",
  "needs",
  "reservations",
  "reservation_events",
  "reservation_messages",
  "reviews",
  "need_alerts",
  "giveaway_days",
  "giveaway_slots",
  "giveaway_bookings",
] as const;

interface ForeignKey {
  from: string;
  table: string;
}

export async function scaleDemo(k: Knex, times: number): Promise<Record<string, number>> {
  const copied = new Set<string>(TABLES);
  const keys = new Map<string, ForeignKey[]>();
  const integerId = new Set<string>();
  for (const t of TABLES) {
    const fks = (await k.raw(`PRAGMA foreign_key_list('${t}')`)) as { from: string; table: string }[];
    keys.set(
      t,
      fks.filter((f) => copied.has(f.table)).map((f) => ({ from: f.from, table: f.table })),
    );
    const cols = (await k.raw(`PRAGMA table_info('${t}')`)) as { name: string; type: string; pk: number }[];
    if (cols.some((c) => c.name === "id" && c.pk && /int/i.test(c.type))) integerId.add(t);
  }
  const originals = new Map<string, Record<string, unknown>[]>();
  for (const t of TABLES) originals.set(t, await k(t).select("*"));

  const added: Record<string, number> = {};
  await k.transaction(async (trx) => {
    for (let copy = 1; copy < times; copy++) {
      const newId = (table: string, id: unknown) => seedId(`scale:${copy}:${table}:${String(id)}`);
      for (const t of TABLES) {
        const rows = originals.get(t)!.map((row) => {
          const out: Record<string, unknown> = { ...row };
          if (integerId.has(t)) delete out.id;
          else out.id = newId(t, row.id);
          for (const fk of keys.get(t)!) if (row[fk.from] !== null && row[fk.from] !== undefined) out[fk.from] = newId(fk.table, row[fk.from]);
          // A pickup code names one reservation: each copy gets its own.
          if (t === "reservations" && typeof row.pickup_code === "string") out.pickup_code = `${String(row.pickup_code).slice(0, 4)}${String(copy).padStart(2, "0")}`;
          return out;
        });
        if (rows.length) await trx.batchInsert(t, rows, 100);
        added[t] = (added[t] ?? 0) + rows.length;
      }
    }
  });
  return added;
}
