// A synthetic county for the benchmark: listings clustered around a dozen invented
// villages plus a scatter of farms, over about 50 × 50 km centred on Fernhollow, with a
// material mix, units, prices and statuses like the demo's. Written to its own SQLite file,
// or with DATABASE_URL set to its own database on that PostgreSQL server.
//
// Up to 100,000 listings the county only gets denser. Past that the table covers a region
// of several counties at the county's density (1,000,000 listings: about 158 × 158 km with
// 120 villages), so a 25 km search reads a county's worth of listings whatever the table holds.
import fs from "node:fs";
import path from "node:path";
import knex, { type Knex } from "knex";
import { pgConfig, sqliteConfig } from "@/knexfile";
import { isPg } from "@/db/dialect";
import { adminConnection, createDatabase, databaseUrl, dropDatabase } from "../helpers/pg-databases";
import { BAG_M3, BALE_M3, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { approximatePoint, locationKey, placeOwner } from "@/lib/geo/approximate";
import { prng } from "@/seeds/ids";

export const CENTRE = { lat: 52.205, lng: 0.847 };
export const HALF_SIDE_KM = 25;
/** Listings the county holds at most; more spread over a wider region at this density. */
const COUNTY_LISTINGS = 100_000;

/** Half the side of the square the dataset covers, km. */
export function halfSideKm(size: number): number {
  return HALF_SIDE_KM * Math.sqrt(Math.max(1, size / COUNTY_LISTINGS));
}
const KM_PER_DEG_LAT = 111.2;
const KM_PER_DEG_LNG = KM_PER_DEG_LAT * Math.cos((CENTRE.lat * Math.PI) / 180);

/** A point `x`, `y` km east and north of the centre. */
export const at = (x: number, y: number) => ({ lat: CENTRE.lat + y / KM_PER_DEG_LAT, lng: CENTRE.lng + x / KM_PER_DEG_LNG });

type Unit = "sheets" | "m2" | "bags" | "m3" | "bales" | "kg";
interface Kind {
  material: MaterialCode;
  share: number;
  make: (r: () => number) => { unit: Unit; unit_size: number | null; unit_mass_kg: number | null; qty: number; price: number; max: number | null };
}

const pick = <T,>(r: () => number, xs: T[]) => xs[Math.floor(r() * xs.length)];
const free = (r: () => number, p: number, priced: () => number) => (r() < p ? 0 : priced());

// Shares roughly as in the demo town: leaves and cardboard common, worms and straw scarcer.
const KINDS: Kind[] = [
  { material: "leaves", share: 0.24, make: (r) => (r() < 0.7
    ? { unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, qty: 2 + Math.floor(r() * 14), price: free(r, 0.85, () => pick(r, [50, 100, 150])), max: r() < 0.4 ? 10 : null }
    : { unit: "m3", unit_size: null, unit_mass_kg: null, qty: 1 + Math.floor(r() * 30), price: 0, max: pick(r, [1, 1.5, 2, null]) }) },
  { material: "cardboard", share: 0.2, make: (r) => (r() < 0.85
    ? { unit: "sheets", unit_size: pick(r, [0.5, 0.6, 0.8, 1.0]), unit_mass_kg: null, qty: 5 + Math.floor(r() * 40), price: 0, max: r() < 0.5 ? 20 : null }
    : { unit: "m2", unit_size: null, unit_mass_kg: null, qty: 5 + Math.floor(r() * 30), price: 0, max: null }) },
  { material: "wood_chips", share: 0.1, make: (r) => ({ unit: "m3", unit_size: null, unit_mass_kg: null, qty: 2 + Math.floor(r() * 25), price: free(r, 0.8, () => pick(r, [500, 1000])), max: pick(r, [2, 3, null]) }) },
  { material: "straw", share: 0.09, make: (r) => ({ unit: "bales", unit_size: BALE_M3, unit_mass_kg: pick(r, [16, 18, 20, 22, 25]), qty: 2 + Math.floor(r() * 40), price: pick(r, [300, 350, 400, 450, 500, 600]), max: pick(r, [5, 10, 12, null]) }) },
  { material: "grass_clippings", share: 0.09, make: (r) => ({ unit: "bags", unit_size: BAG_M3, unit_mass_kg: null, qty: 1 + Math.floor(r() * 6), price: 0, max: null }) },
  { material: "coffee_grounds", share: 0.08, make: (r) => (r() < 0.8
    ? { unit: "kg", unit_size: null, unit_mass_kg: null, qty: 5 + Math.floor(r() * 40), price: 0, max: pick(r, [10, 20, null]) }
    : { unit: "bags", unit_size: 0.02, unit_mass_kg: null, qty: 2 + Math.floor(r() * 10), price: 0, max: null }) },
  { material: "manure", share: 0.07, make: (r) => (r() < 0.6
    ? { unit: "bags", unit_size: 0.04, unit_mass_kg: null, qty: 5 + Math.floor(r() * 30), price: free(r, 0.5, () => pick(r, [100, 150, 200])), max: 10 }
    : { unit: "m3", unit_size: null, unit_mass_kg: null, qty: 1 + Math.floor(r() * 10), price: free(r, 0.6, () => pick(r, [1500, 2500])), max: 2 }) },
  { material: "worms", share: 0.07, make: (r) => ({ unit: "kg", unit_size: null, unit_mass_kg: null, qty: 1 + Math.floor(r() * 8), price: pick(r, [1800, 2200, 2600, 3000, 3200, 3600]), max: pick(r, [1, 2, 3, null]) }) },
  { material: "compost", share: 0.06, make: (r) => ({ unit: "m3", unit_size: null, unit_mass_kg: null, qty: 1 + Math.floor(r() * 12), price: free(r, 0.5, () => pick(r, [2000, 3000])), max: pick(r, [0.5, 1, null]) }) },
];

const STATUSES: [string, number][] = [["active", 0.88], ["paused", 0.04], ["hidden", 0.03], ["archived", 0.02], ["expired", 0.02], ["gone", 0.01]];

function weighted<T>(r: () => number, xs: [T, number][]): T {
  let u = r();
  for (const [x, w] of xs) if ((u -= w) < 0) return x;
  return xs[xs.length - 1][0];
}

// Gaussian from two uniforms (Box–Muller).
const gauss = (r: () => number) => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());

/** Where one size's dataset lives, and what a server process needs in its environment to open it. */
export interface BenchStore {
  label: string;
  env: { DATABASE_FILE: string } | { DATABASE_URL: string };
  open: () => Knex;
}

/** A new, empty store for `size` listings (or named `size`): a file in `dir`, or a database on DATABASE_URL's server. */
export async function emptyStore(dir: string, size: number | string): Promise<BenchStore> {
  if (!process.env.DATABASE_URL) {
    const file = path.join(dir, `duffbank-bench-${size}.sqlite`);
    for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
    return { label: file, env: { DATABASE_FILE: file }, open: () => knex(sqliteConfig(file)) };
  }
  const name = `duffbank_bench_${size}`;
  const admin = adminConnection();
  try {
    await dropDatabase(admin, name);
    await createDatabase(admin, name);
  } finally {
    await admin.destroy();
  }
  const url = databaseUrl(name);
  return { label: `database ${name}`, env: { DATABASE_URL: url }, open: () => knex(pgConfig(url)) };
}

const COLUMNS = [
  "id", "owner_id", "material_code", "title", "description", "status", "unit", "unit_size", "unit_mass_kg", "quantity_total", "quantity_held",
  "quantity_collected", "price_cents", "currency", "deposit_cents", "max_per_reservation", "auto_accept", "lat", "lng", "address",
  "approx_lat", "approx_lng", "available_from", "available_until", "quality", "created_at", "updated_at",
] as const;
/** Rows per transaction while writing: keeps the write-ahead log to a few hundred MB. */
const CHUNK = 50_000;

interface Sqlite {
  pragma(sql: string): unknown;
  prepare(sql: string): { run(...args: unknown[]): unknown };
  transaction(fn: () => void): () => void;
}

/**
 * Write `size` rows made by `row`, CHUNK to a transaction. On SQLite straight through the
 * driver with one prepared statement (the triggers and indexes do the same work as for any
 * listing, without a million query builders in between); on PostgreSQL in batches of 1,000.
 */
async function writeListings(k: Knex, size: number, row: (i: number) => unknown[]): Promise<void> {
  if (isPg(k)) {
    const asObject = (values: unknown[]) => Object.fromEntries(COLUMNS.map((c, j) => [c, c === "auto_accept" ? values[j] === 1 : values[j]]));
    for (let from = 0; from < size; from += CHUNK) {
      await k.transaction(async (trx) => {
        for (let i = from; i < Math.min(size, from + CHUNK); i += 1000) {
          await trx("listings").insert(Array.from({ length: Math.min(1000, size - i, from + CHUNK - i) }, (_, j) => asObject(row(i + j))));
        }
      });
    }
    return;
  }
  const conn = (await k.client.acquireConnection()) as Sqlite;
  // Room for the indexes being filled (SQLite keeps 2 MB by default), else every insert
  // reads index pages back in from the file once the table outgrows the cache.
  conn.pragma("cache_size = -524288");
  try {
    const insert = conn.prepare(`INSERT INTO listings (${COLUMNS.join(", ")}) VALUES (${COLUMNS.map(() => "?").join(", ")})`);
    for (let from = 0; from < size; from += CHUNK) {
      conn.transaction(() => {
        for (let i = from; i < Math.min(size, from + CHUNK); i++) insert.run(...row(i));
      })();
    }
  } finally {
    conn.pragma("cache_size = -2000");
    await k.client.releaseConnection(conn);
  }
}

export async function buildDataset(store: BenchStore, size: number): Promise<Knex> {
  const k = store.open();
  await k.migrate.latest();
  const r = prng(size);
  const created = "2026-11-01T09:00:00.000Z";
  const regions = Math.max(1, size / COUNTY_LISTINGS);
  const half = halfSideKm(size);
  await k("materials").insert(Object.values(MATERIALS).map((m) => ({ code: m.code, name: m.name, n_pct: m.n_pct, cn_ratio: m.cn_ratio, moisture_pct: m.moisture_pct, bulk_density_kg_m3: m.bulk_density_kg_m3, default_unit: m.default_unit, source: m.source })));
  const owners = Array.from({ length: Math.round(200 * regions) }, (_, i) => `bench-owner-${i}`);
  await k.batchInsert("users", owners.map((id, i) => ({ id, email: `bench${i}@bench.invalid`, display_name: `Bench supplier ${i}`, unit_system: "metric", reminders_opt_out: false, created_at: created, updated_at: created })), 100);

  const villages = Array.from({ length: Math.round(12 * regions) }, () => ({ ...at((r() * 2 - 1) * (half - 5), (r() * 2 - 1) * (half - 5)), spread: 1 + r() * 3 }));
  const kinds: [Kind, number][] = KINDS.map((kd) => [kd, kd.share]);
  const now = Date.now();
  const key = locationKey();
  const clamp = (x: number) => Math.max(-half, Math.min(half, x));
  await writeListings(k, size, (i) => {
    // Seven in ten listings are in a village, the rest anywhere in the county.
    let p: { lat: number; lng: number };
    if (r() < 0.7) {
      const v = pick(r, villages);
      p = at(clamp((v.lng - CENTRE.lng) * KM_PER_DEG_LNG + gauss(r) * v.spread), clamp((v.lat - CENTRE.lat) * KM_PER_DEG_LAT + gauss(r) * v.spread));
    } else p = at((r() * 2 - 1) * half, (r() * 2 - 1) * half);
    const kind = weighted(r, kinds);
    const m = kind.make(r);
    const held = r() < 0.1 ? m.qty : r() < 0.2 ? Math.floor(m.qty / 2) : 0;
    const owner = pick(r, owners);
    const approx = approximatePoint({ owner: placeOwner({ owner_id: owner }), lat: p.lat, lng: p.lng }, key);
    const until = new Date(now + (r() < 0.05 ? -1 : 1) * (1 + r() * 200) * 86_400_000).toISOString();
    return [
      `bench-${size}-${i}`, owner, kind.material, `${MATERIALS[kind.material].name} ${i}`, "", weighted(r, STATUSES), m.unit, m.unit_size, m.unit_mass_kg,
      m.qty, held, 0, m.price, "eur", 0, m.max, r() < 0.5 ? 1 : 0, p.lat, p.lng, `${i} Bench Lane`, approx.lat, approx.lng, created, until, "{}", created, created,
    ];
  });
  // PostgreSQL plans from statistics: gather them now rather than whenever autovacuum would.
  if (isPg(k)) await k.raw("ANALYZE");
  return k;
}
