// npm run bench — matching at 1k, 10k, 100k and 1M listings against a naive full scan, then the
// HTTP throughput of /api/listings, /api/match and /api/estimate against /api/health on a
// production build, at 100k and 1M listings. SQLite, or PostgreSQL with DATABASE_URL set.
// Environment: BENCH_SIZES=1000,10000 to run fewer sizes; BENCH_HTTP=0 to skip the HTTP part;
// BENCH_HTTP_SIZES=100000 to measure HTTP at fewer sizes (default: every size from 100,000);
// BENCH_NAIVE=0 to leave out the full scans (minutes at 100,000 listings on a busy machine).
// Then the alert fan-out at 100,000 open needs (tests/bench/needs.ts): BENCH_OPEN_NEEDS=0 skips it, or
// sets another count; BENCH_SIZES=0 runs only the needs. Then the signed-in pages with the demo
// twenty times over (tests/bench/pages.ts, SQLite): BENCH_PAGES=0 skips them.
import os from "node:os";
import { performance } from "node:perf_hooks";
import type { Knex } from "knex";
import { MATERIAL_CODES } from "@/lib/calc/facts";
import { estimate } from "@/lib/calc/estimate";
import { databaseSource, nearestListings } from "@/db/match-candidates";
import { matchPlan } from "@/lib/match/plan";
import { searchPlan } from "@/lib/match/search";
import type { Need } from "@/lib/match/types";
import { prng } from "@/seeds/ids";
import { at, type BenchStore, buildDataset, emptyStore, halfSideKm } from "./dataset";
import { runHttpBench, type HttpResult } from "./http";
import { naiveCandidates, naiveNearest } from "./naive";
import { needsTable, runNeedsBench } from "./needs";
import { pagesTable, runPagesBench } from "./pages";

const SIZES = (process.env.BENCH_SIZES ?? "1000,10000,100000,1000000").split(",").map(Number).filter((n) => n > 0);
const HTTP_SIZES = process.env.BENCH_HTTP_SIZES ? process.env.BENCH_HTTP_SIZES.split(",").map(Number) : SIZES.filter((n) => n >= 100_000);
/** App processes to measure HTTP with: one on SQLite (a file on one machine); one and two on PostgreSQL. */
const HTTP_PROCESSES = (process.env.BENCH_HTTP_PROCESSES ?? (process.env.DATABASE_URL ? "1,2" : "1")).split(",").map(Number);
/** A full scan of a million rows takes tens of seconds a run, so the naive side stops here. */
const NAIVE_MAX = 100_000;
const RADIUS_KM = 25;
const NEAR_LIMIT = 50;

/** Five needs: a 4 × 2.5 m bed's cardboard, leaves, straw and worms, and coffee grounds to go with them. */
export const BENCH_NEEDS: Need[] = [
  ...estimate({ bed: { length_m: 4, width_m: 2.5 } }).needs.map((n) => ({ material: n.material, quantity: n.quantity, unit: n.unit })),
  { material: "coffee_grounds", quantity: 10, unit: "kg" },
];

function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

async function time<T>(runs: number, origins: { lat: number; lng: number }[], fn: (o: { lat: number; lng: number }) => Promise<T>) {
  // Warm-up, so the first size does not pay for the JIT compiling the matcher.
  for (let i = 0; i < Math.min(20, runs); i++) await fn(origins[(origins.length - 1 - i) % origins.length]);
  const ms: number[] = [];
  const out: T[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    out.push(await fn(origins[i % origins.length]));
    ms.push(performance.now() - t);
  }
  return { p50: ms.length ? percentile(ms, 50) : NaN, p95: ms.length ? percentile(ms, 95) : NaN, out };
}

const f1 = (x: number) => (Number.isNaN(x) ? "—" : x.toFixed(x < 10 ? 2 : 1));
const times = (a: number, b: number) => (Number.isNaN(a / b) ? "—" : (a / b).toFixed(0));

interface Row {
  size: number;
  near: { p50: number; p95: number };
  nearNaive: { p50: number; p95: number };
  match: { p50: number; p95: number };
  matchNaive: { p50: number; p95: number };
  candidates: number;
  costRatio: number;
}

async function benchSize(size: number, dir: string): Promise<{ row: Row; k: Knex; store: BenchStore }> {
  const store = await emptyStore(dir, size);
  const t0 = performance.now();
  const k = await buildDataset(store, size);
  console.log(`[bench] ${size.toLocaleString("en-US")} listings written to ${store.label} in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  const r = prng(7 + size);
  const half = halfSideKm(size);
  const origins = Array.from({ length: 200 }, () => at((r() * 2 - 1) * (half - 3), (r() * 2 - 1) * (half - 3)));
  const runs = 200;
  const naiveRuns = process.env.BENCH_NAIVE === "0" || size > NAIVE_MAX ? 0 : size >= 100_000 ? 30 : size >= 10_000 ? 60 : 200;
  const source = databaseSource(k);
  const materials = BENCH_NEEDS.map((n) => n.material);

  const near = await time(runs, origins, (o) => nearestListings({ origin: o, radius_km: RADIUS_KM, materials: MATERIAL_CODES, limit: NEAR_LIMIT }, k));
  const nearNaive = await time(naiveRuns, origins, (o) => naiveNearest(k, o, RADIUS_KM, MATERIAL_CODES, NEAR_LIMIT));
  // The indexed query must find exactly the naive scan's nearest listings.
  near.out.slice(0, naiveRuns).forEach((found, i) => {
    if (found.map((c) => c.id).join() !== nearNaive.out[i].map((c) => c.id).join()) throw new Error(`near-query differs from the full scan at origin ${i}`);
  });
  const match = await time(runs, origins, (o) => searchPlan(BENCH_NEEDS, o, RADIUS_KM, source));
  const matchNaive = await time(naiveRuns, origins, async (o) => matchPlan(BENCH_NEEDS, await naiveCandidates(k, o, RADIUS_KM, materials), o));
  const ratios = matchNaive.out.map((plan, i) => match.out[i].plan.totals.cost_cents / plan.totals.cost_cents);
  const unmet = match.out.slice(0, naiveRuns).filter((x, i) => x.plan.unmet.length !== matchNaive.out[i].unmet.length).length;
  if (unmet) console.log(`[bench] ${unmet} origins where the indexed plan left a different number of needs unmet than the full scan`);
  const row: Row = {
    size,
    near,
    nearNaive,
    match,
    matchNaive,
    candidates: match.out.reduce((s, x) => s + x.stats.candidates, 0) / match.out.length,
    costRatio: ratios.reduce((a, b) => a + b, 0) / ratios.length,
  };
  return { row, k, store };
}

function table(rows: Row[]) {
  const lines = [
    "| listings | near-query p50 / p95 (ms) | naive p50 / p95 (ms) | × faster (p95) | match p50 / p95 (ms) | naive match p50 / p95 (ms) | × faster (p95) | listings read per match | plan cost vs naive |",
    "|---:|---:|---:|---:|---:|---:|---:|---:|---:|",
    ...rows.map((r) =>
      `| ${r.size.toLocaleString("en-US")} | ${f1(r.near.p50)} / ${f1(r.near.p95)} | ${f1(r.nearNaive.p50)} / ${f1(r.nearNaive.p95)} | ${times(r.nearNaive.p95, r.near.p95)} | ` +
      `${f1(r.match.p50)} / ${f1(r.match.p95)} | ${f1(r.matchNaive.p50)} / ${f1(r.matchNaive.p95)} | ${times(r.matchNaive.p95, r.match.p95)} | ${r.candidates.toFixed(0)} | ${Number.isNaN(r.costRatio) ? "— (no full scan)" : `${(100 * r.costRatio).toFixed(1)} %`} |`,
    ),
  ];
  return lines.join("\n");
}

async function main() {
  const dir = process.env.BENCH_DIR ?? os.tmpdir();
  const engine = process.env.DATABASE_URL ? "PostgreSQL (DATABASE_URL)" : "SQLite";
  console.log(`[bench] ${engine}; ${os.cpus().length} × ${os.cpus()[0]?.model ?? "cpu"}, Node ${process.version}; load average ${os.loadavg().map((x) => x.toFixed(1)).join(" ")}; ${BENCH_NEEDS.length} needs within ${RADIUS_KM} km; near-query = the ${NEAR_LIMIT} nearest listings within ${RADIUS_KM} km`);
  const rows: Row[] = [];
  const stores = new Map<number, BenchStore>();
  for (const size of SIZES) {
    const { row, k, store } = await benchSize(size, dir);
    rows.push(row);
    await k.destroy();
    if (HTTP_SIZES.includes(size)) stores.set(size, store);
  }
  if (rows.length) console.log(`\n${table(rows)}\n`);
  const [first, last] = [rows[0], rows[rows.length - 1]];
  if (rows.length > 1) {
    const naive = Number.isNaN(last.matchNaive.p95) ? "" : `, the naive scan's ${(last.matchNaive.p95 / first.matchNaive.p95).toFixed(1)}×`;
    console.log(`[bench] listings grew ${(last.size / first.size).toFixed(0)}×; match p95 grew ${(last.match.p95 / first.match.p95).toFixed(1)}×${naive}`);
  }
  // The alert fan-out: what a new listing costs at 100,000 open needs.
  const needsCount = Number(process.env.BENCH_OPEN_NEEDS ?? 100_000);
  if (needsCount > 0) console.log(`\n${needsTable(await runNeedsBench(dir, needsCount))}\n`);
  // The signed-in pages with the demo twenty times over (SQLite; BENCH_PAGES=0 skips them).
  if (process.env.BENCH_PAGES !== "0" && !process.env.DATABASE_URL) console.log(`\n${pagesTable(await runPagesBench(dir))}\n`);
  if (process.env.BENCH_HTTP === "0" || stores.size === 0) return;
  const http: HttpResult[] = [];
  for (const [size, store] of stores) for (const n of HTTP_PROCESSES) http.push(await runHttpBench(store, size, BENCH_NEEDS, n));
  const single = http.filter((h) => h.processes === HTTP_PROCESSES[0]);
  if (single.length > 1) console.log(`\n${scaleTable(single[0], single[single.length - 1])}`);
  if (HTTP_PROCESSES.length > 1) console.log(`\n${processTable(http)}`);
}

/** How throughput grows with app processes, per size and route (on a machine with os.cpus() cores, autocannon and the database on it too). */
function processTable(http: HttpResult[]): string {
  const counts = [...new Set(http.map((h) => h.processes))];
  const lines = [
    `[bench] HTTP requests/s by app processes (${os.cpus().length} cores, shared with the load generator and the database server)`,
    "",
    `| listings | endpoint | ${counts.map((n) => `${n} process${n > 1 ? "es" : ""}`).join(" | ")} | × from ${counts[0]} to ${counts[counts.length - 1]} |`,
    `|---:|---|${counts.map(() => "---:").join("|")}|---:|`,
  ];
  for (const size of [...new Set(http.map((h) => h.size))]) {
    const bySize = http.filter((h) => h.size === size);
    for (const row of bySize[0].rows) {
      const rps = counts.map((n) => bySize.find((h) => h.processes === n)?.rows.find((x) => x.name === row.name)?.rps ?? NaN);
      lines.push(`| ${size.toLocaleString("en-US")} | ${row.name} | ${rps.map((x) => x.toFixed(0)).join(" | ")} | ${(rps[rps.length - 1] / rps[0]).toFixed(2)} |`);
    }
  }
  return lines.join("\n");
}

/** The biggest size against the first HTTP size: throughput may drop at most 1.5×. */
function scaleTable(small: HttpResult, big: HttpResult): string {
  const lines = [
    `[bench] HTTP at ${big.size.toLocaleString("en-US")} against ${small.size.toLocaleString("en-US")} listings (target: each route within 1.5×: its share of /api/health's requests/s at least 0.67× the smaller size's)`,
    "",
    `| endpoint | ${small.size.toLocaleString("en-US")}: requests/s (× health) | ${big.size.toLocaleString("en-US")}: requests/s (× health) | ratio | met |`,
    "|---|---:|---:|---:|---|",
  ];
  for (const s of small.rows) {
    const b = big.rows.find((x) => x.name === s.name);
    if (!b) continue;
    // Against /api/health in the same run, so a machine busier in one run than the other does not count.
    const ratio = b.ofHealth / s.ofHealth;
    lines.push(`| ${s.name} | ${s.rps.toFixed(0)} (${s.ofHealth.toFixed(2)}×) | ${b.rps.toFixed(0)} (${b.ofHealth.toFixed(2)}×) | ${ratio.toFixed(2)} | ${ratio >= 1 / 1.5 ? "yes" : "no"} |`);
  }
  return lines.join("\n");
}

if (process.argv[1]?.endsWith("run.ts")) main().catch((err) => {
  console.error(err);
  process.exit(1);
});
