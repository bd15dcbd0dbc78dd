// The alert fan-out at 100,000 open needs: for each new listing, the open needs it could
// serve (needsReaching: a box per reach band through needs_reach_box, or needs_near on
// PostgreSQL when DATABASE_URL is set, then Turf), against the
// naive way (read every open need, measure each with Turf). Both must find the same needs.
// Then the whole fan-out with its writes (alerts, and e-mails for the "at once" needs).
// Needs are spread over the same 50 × 50 km county as the listings, seven in ten around a
// dozen villages. Environment: BENCH_OPEN_NEEDS=100000 (how many; 0 skips this part).
import { performance } from "node:perf_hooks";
import type { Knex } from "knex";
import { isPg } from "@/db/dialect";
import { BAG_M3, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import type { ListingUnit } from "@/lib/match/types";
import { needPerListingUnit } from "@/lib/match/units";
import { reachBand } from "@/lib/needs/reach";
import { needsReaching, type AlertingListing } from "@/lib/needs/reaching";
import { alertNeedsFor } from "@/lib/services/needs/alert-needs";
import { approximatePoint, placeOwner } from "@/lib/geo/approximate";
import { DUE_NOW } from "@/migrations/20261208_020_open_needs";
import { prng } from "@/seeds/ids";
import { at, type BenchStore, emptyStore, HALF_SIDE_KM } from "./dataset";

type Timing = { p50: number; p95: number };

// What people ask for, roughly: leaves and cardboard most, worms and grounds least (a guess for the bench).
const MATERIAL_SHARE: [MaterialCode, number][] = [
  ["leaves", 0.3], ["cardboard", 0.18], ["wood_chips", 0.12], ["compost", 0.12], ["straw", 0.08], ["manure", 0.06], ["worms", 0.05], ["coffee_grounds", 0.05], ["grass_clippings", 0.04],
];
// How far people say they will go, km: mostly a short drive.
const RADIUS_SHARE: [number, number][] = [[2, 0.1], [5, 0.3], [10, 0.4], [25, 0.15], [50, 0.05]];
const CLOSED_SHARE: [string, number][] = [["met", 0.5], ["closed", 0.3], ["expired", 0.2]];

function weighted<T>(r: () => number, xs: [T, number][]): T {
  let u = r();
  for (const [x, w] of xs) if ((u -= w) < 0) return x;
  return xs[xs.length - 1][0];
}
const gauss = (r: () => number) => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
const clamp = (x: number) => Math.max(-HALF_SIDE_KM, Math.min(HALF_SIDE_KM, x));

function placer(seed: number) {
  const r = prng(seed);
  const villages = Array.from({ length: 12 }, () => ({ x: (r() * 2 - 1) * 20, y: (r() * 2 - 1) * 20, spread: 1 + r() * 3 }));
  return () => {
    if (r() < 0.7) {
      const v = villages[Math.floor(r() * villages.length)];
      return at(clamp(v.x + gauss(r) * v.spread), clamp(v.y + gauss(r) * v.spread));
    }
    return at((r() * 2 - 1) * HALF_SIDE_KM, (r() * 2 - 1) * HALF_SIDE_KM);
  };
}

const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

async function buildNeeds(store: BenchStore, count: number): Promise<Knex> {
  const k = store.open();
  await k.migrate.latest();
  const created = new Date().toISOString();
  await k("materials").insert(Object.values(MATERIALS).map((m) => ({ code: m.code, name: m.name, n_pct: m.n_pct, cn_ratio: m.cn_ratio, moisture_pct: m.moisture_pct, bulk_density_kg_m3: m.bulk_density_kg_m3, default_unit: m.default_unit, source: m.source })));
  const people = Math.max(1, Math.round(count / 5));
  const users = Array.from({ length: people }, (_, i) => ({ id: `g${i}`, email: `g${i}@bench.invalid`, display_name: `Gardener ${i}`, unit_system: "metric", reminders_opt_out: false, created_at: created, updated_at: created }));
  users.push({ id: "supplier", email: "supplier@bench.invalid", display_name: "Bench supplier", unit_system: "metric", reminders_opt_out: false, created_at: created, updated_at: created });
  await k.transaction(async (trx) => {
    for (let i = 0; i < users.length; i += 500) await trx("users").insert(users.slice(i, i + 500));
  });
  const r = prng(count);
  const place = placer(count + 1);
  const rows: Record<string, unknown>[] = [];
  // `count` open needs, and one in ten more met, closed or expired beside them, as history leaves.
  const total = Math.round(count * 1.1);
  for (let i = 0; i < total; i++) {
    const material = weighted(r, MATERIAL_SHARE);
    const radius = weighted(r, RADIUS_SHARE);
    const p = place();
    const kg = material === "worms" || material === "coffee_grounds";
    rows.push({
      id: `n${i}`, owner_id: `g${Math.floor(r() * people)}`, bed_id: null, material_code: material,
      quantity: kg ? 1 + Math.round(r() * 20) : material === "cardboard" ? 2 + Math.round(r() * 10) : 0.2 + Math.round(r() * 20) / 10,
      unit: kg ? "kg" : material === "cardboard" ? "m2" : "m3", radius_km: radius, reach_km: reachBand(radius), lat: p.lat, lng: p.lng,
      // One in twenty is past its day and not yet swept by the worker.
      needed_by: day(r() < 0.05 ? -1 - Math.floor(r() * 20) : 1 + Math.floor(r() * 180)),
      alerts: r() < 0.3 ? "immediate" : "daily", status: i < count ? "open" : weighted(r, CLOSED_SHARE), closed_at: null, created_at: created, updated_at: created,
    });
  }
  await k.transaction(async (trx) => {
    for (let i = 0; i < rows.length; i += 500) await trx("needs").insert(rows.slice(i, i + 500));
  });
  // PostgreSQL plans from statistics: give it those of the table as it now is.
  if (isPg(k)) await k.raw("ANALYZE needs");
  return k;
}

/** A new listing somewhere in the county, of a material in the same shares, in its usual unit. */
function newListings(n: number, seed: number): AlertingListing[] {
  const r = prng(seed);
  const place = placer(seed + 1);
  const today = day(0);
  return Array.from({ length: n }, (_, i) => {
    const material = weighted(r, MATERIAL_SHARE);
    const unit: ListingUnit = material === "worms" || material === "coffee_grounds" ? "kg" : material === "cardboard" ? "sheets" : "bags";
    return { id: `new-${i}`, owner_id: "supplier", material, unit, unit_size: unit === "sheets" ? 0.8 : unit === "bags" ? BAG_M3 : null, unit_mass_kg: null, location: place(), from_day: today };
  });
}

/** The naive way: every open need read, each measured with Turf. */
async function naiveReaching(k: Knex, l: AlertingListing): Promise<string[]> {
  const rows: { id: string; owner_id: string; material_code: string; unit: "m2" | "m3" | "kg"; radius_km: number; lat: number; lng: number; needed_by: string; status: string }[] = await k("needs").select("id", "owner_id", "material_code", "unit", "radius_km", "lat", "lng", "needed_by", "status");
  return rows
    .filter((n) => n.status === "open" && n.material_code === l.material && n.owner_id !== l.owner_id && n.needed_by >= l.from_day && needPerListingUnit(l, n.unit) !== null && distanceKm(n, l.location) <= n.radius_km)
    .map((n) => n.id);
}

function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}
async function time<T>(items: AlertingListing[], fn: (l: AlertingListing) => Promise<T>): Promise<Timing & { out: T[] }> {
  for (const l of items.slice(0, 5)) await fn(l); // warm-up
  const ms: number[] = [];
  const out: T[] = [];
  for (const l of items) {
    const t = performance.now();
    out.push(await fn(l));
    ms.push(performance.now() - t);
  }
  return { p50: percentile(ms, 50), p95: percentile(ms, 95), out };
}

export interface NeedsBenchRow {
  needs: number;
  indexed: Timing;
  naive: Timing;
  read: number;
  alerts: number;
  withWrites: Timing;
  written: number;
}

export async function runNeedsBench(dir: string, count: number): Promise<NeedsBenchRow> {
  const store = await emptyStore(dir, `needs_${count}`);
  const t0 = performance.now();
  const k = await buildNeeds(store, count);
  console.log(`[bench] ${count.toLocaleString("en-US")} open needs (and ${Math.round(count * 0.1).toLocaleString("en-US")} closed) written to ${store.label} in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  try {
    const listings = newListings(200, 4242);
    const reads: number[] = [];
    const indexed = await time(listings, async (l) => {
      const stats = { read: 0 };
      const found = await needsReaching(l, k, stats);
      reads.push(stats.read);
      return found;
    });
    const naiveSet = listings.slice(0, 40);
    const naive = await time(naiveSet, (l) => naiveReaching(k, l));
    // The indexed search must find exactly what the full scan finds.
    naive.out.forEach((ids, i) => {
      const got = indexed.out[i].map((x) => x.need.id).sort().join();
      if (got !== [...ids].sort().join()) throw new Error(`needs reached differ from the full scan for listing ${i}`);
    });

    // The whole fan-out: each listing written, checked, its alerts and "at once" e-mails written.
    const created = new Date().toISOString();
    const written = newListings(30, 777);
    for (const l of written) {
      const approx = approximatePoint({ owner: placeOwner({ owner_id: l.owner_id }), lat: l.location.lat, lng: l.location.lng });
      await k("listings").insert({
        id: l.id, owner_id: l.owner_id, material_code: l.material, title: `New ${l.material}`, description: "", status: "active", unit: l.unit, unit_size: l.unit_size,
        quantity_total: 10, lat: l.location.lat, lng: l.location.lng, address: "1 Bench Lane", approx_lat: approx.lat, approx_lng: approx.lng,
        quality: "{}", needs_due_at: DUE_NOW, created_at: created, updated_at: created,
      });
    }
    const alertsBefore = Number((await k("need_alerts").count({ n: "*" }))[0].n);
    const withWrites = await time(written.slice(5), (l) => alertNeedsFor(l.id, { db: k }));
    const alertsAfter = Number((await k("need_alerts").count({ n: "*" }))[0].n);
    return {
      needs: count,
      indexed,
      naive,
      read: reads.reduce((a, b) => a + b, 0) / reads.length,
      alerts: indexed.out.reduce((s, x) => s + x.length, 0) / indexed.out.length,
      withWrites,
      written: (alertsAfter - alertsBefore) / (written.length - 5),
    };
  } finally {
    await k.destroy();
  }
}

const f1 = (x: number) => x.toFixed(x < 10 ? 2 : 1);

export function needsTable(r: NeedsBenchRow): string {
  return [
    "| open needs | alerts computed per new listing p50 / p95 (ms) | naive p50 / p95 (ms) | × faster (p95) | needs read per listing | alerts per listing | with writing alerts and e-mails p50 / p95 (ms) |",
    "|---:|---:|---:|---:|---:|---:|---:|",
    `| ${r.needs.toLocaleString("en-US")} | ${f1(r.indexed.p50)} / ${f1(r.indexed.p95)} | ${f1(r.naive.p50)} / ${f1(r.naive.p95)} | ${(r.naive.p95 / r.indexed.p95).toFixed(0)} | ${r.read.toFixed(0)} | ${r.alerts.toFixed(0)} | ${f1(r.withWrites.p50)} / ${f1(r.withWrites.p95)} |`,
  ].join("\n");
}
