// Throughput on a production build (tests/bench/server.ts) over one of the benchmark's
// databases, loaded by autocannon, each route against /api/health in the same run.
import os from "node:os";
import autocannon from "autocannon";
import type { Need } from "@/lib/match/types";
import { prng } from "@/seeds/ids";
import { at, type BenchStore, halfSideKm } from "./dataset";
import { type RunningApp, startApp } from "./server";

/** Seconds of load per route in all. */
const SECONDS = Number(process.env.BENCH_HTTP_SECONDS ?? 15);
const CONNECTIONS = Number(process.env.BENCH_HTTP_CONNECTIONS ?? 10);

interface Target {
  name: string;
  /** The least share of /api/health's requests/s this route should reach (issue #15). */
  target?: number;
  opts: (base: string) => Record<string, unknown>;
}

export interface HttpRow {
  name: string;
  rps: number;
  ofHealth: number;
  target?: number;
  p50: number;
  p97_5: number;
  p99: number;
  non2xx: number;
  errors: number;
}

export interface HttpResult {
  size: number;
  processes: number;
  rows: HttpRow[];
}

type Result = Awaited<ReturnType<typeof autocannon>>;

/** Several autocannon runs at once (one per app process, as a balancer would spread them), as one result. */
function merged(results: Result[]): Result {
  return {
    requests: { average: results.reduce((s, r) => s + r.requests.average, 0) },
    latency: {
      p50: Math.max(...results.map((r) => r.latency.p50)),
      p97_5: Math.max(...results.map((r) => r.latency.p97_5)),
      p99: Math.max(...results.map((r) => r.latency.p99)),
    },
    non2xx: results.reduce((s, r) => s + r.non2xx, 0),
    errors: results.reduce((s, r) => s + r.errors, 0),
    timeouts: results.reduce((s, r) => s + r.timeouts, 0),
  };
}

/** Seconds per round, rounds per route: the routes take turns, so a spell of load from elsewhere falls on all of them. */
const ROUNDS = Number(process.env.BENCH_HTTP_ROUNDS ?? 3);

/** Load the routes on `processes` app processes over one database (each its own port, the connections split between them). */
export async function runHttpBench(store: BenchStore, size: number, needs: Need[], processes = 1): Promise<HttpResult> {
  const apps: RunningApp[] = [];
  // One after another: the first migrates and seeds, the others find it done.
  for (let i = 0; i < processes; i++) apps.push(await startApp(store.env));
  const fire = async (t: Target, duration: number) =>
    merged(await Promise.all(apps.map((a) => autocannon({ ...t.opts(a.base), connections: Math.max(1, Math.round(CONNECTIONS / processes)), duration }))));
  try {
    const r = prng(11);
    const half = halfSideKm(size);
    const point = () => at((r() * 2 - 1) * (half - 3), (r() * 2 - 1) * (half - 3));
    // Requests as the app's own pages send them: JSON with the app's Origin.
    const post = (b: string, route: string, body: () => unknown) => ({
      url: `${b}${route}`,
      method: "POST",
      headers: { "content-type": "application/json", origin: b },
      requests: [{ setupRequest: (req: Record<string, unknown>) => ({ ...req, body: JSON.stringify(body()) }) }],
    });
    const targets: Target[] = [
      { name: "GET /api/health", opts: (b) => ({ url: `${b}/api/health` }) },
      {
        name: "GET /api/listings?lat&lng (first page, 25 km)",
        target: 0.3,
        opts: (b) => ({
          url: `${b}/api/listings`,
          requests: [{ setupRequest: (req: Record<string, unknown>) => { const p = point(); return { ...req, path: `/api/listings?lat=${p.lat}&lng=${p.lng}&radius_km=25` }; } }],
        }),
      },
      { name: "POST /api/match (5 needs, 25 km)", target: 0.2, opts: (b) => post(b, "/api/match", () => ({ needs, origin: point(), radius_km: 25 })) },
      { name: "POST /api/estimate (4 × 2.5 m bed)", target: 0.8, opts: (b) => post(b, "/api/estimate", () => ({ bed: { length_m: 4, width_m: 2.5 } })) },
    ];
    // Warm-up: the first requests load each route's code and fill the JIT.
    for (const t of targets) await fire(t, 2);
    const load = os.loadavg();
    const runs = new Map<string, Result[]>();
    for (let round = 0; round < ROUNDS; round++) {
      for (const t of targets) {
        const res = await fire(t, SECONDS / ROUNDS);
        runs.set(t.name, [...(runs.get(t.name) ?? []), res]);
      }
    }
    const loadAfter = os.loadavg();
    const summary = (t: Target) => {
      const rs = runs.get(t.name)!;
      const worst = (f: (x: (typeof rs)[number]) => number) => Math.max(...rs.map(f));
      return {
        name: t.name,
        rps: rs.reduce((sum, x) => sum + x.requests.average, 0) / rs.length,
        target: t.target,
        p50: worst((x) => x.latency.p50),
        p97_5: worst((x) => x.latency.p97_5),
        p99: worst((x) => x.latency.p99),
        non2xx: rs.reduce((sum, x) => sum + x.non2xx, 0),
        errors: rs.reduce((sum, x) => sum + x.errors + x.timeouts, 0),
      };
    };
    const health = summary(targets[0]).rps;
    const rows: HttpRow[] = targets.map((t) => {
      const x = summary(t);
      return { ...x, ofHealth: x.rps / health };
    });
    console.log(
      `\n[bench] HTTP, production build, ${size.toLocaleString("en-US")} listings on ${"DATABASE_URL" in store.env ? "PostgreSQL" : "SQLite"}, ${processes} app process${processes > 1 ? "es" : ""}: ${CONNECTIONS} connections, ${ROUNDS} turns of ${(SECONDS / ROUNDS).toFixed(1)} s per route; ` +
        `load average ${load[0].toFixed(1)} before, ${loadAfter[0].toFixed(1)} after, on ${os.cpus().length} cores (autocannon shares them)\n`,
    );
    console.log("| endpoint | requests/s | × health | target | met | latency p50 / p97.5 / p99 (ms), worst turn | non-2xx | errors |");
    console.log("|---|---:|---:|---:|---|---:|---:|---:|");
    for (const x of rows) {
      const met = x.target === undefined ? "" : x.ofHealth >= x.target && x.non2xx === 0 && x.errors === 0 ? "yes" : "no";
      console.log(`| ${x.name} | ${x.rps.toFixed(0)} | ${x.ofHealth.toFixed(2)} | ${x.target === undefined ? "" : `≥ ${x.target}`} | ${met} | ${x.p50} / ${x.p97_5} / ${x.p99} | ${x.non2xx} | ${x.errors} |`);
    }
    return { size, processes, rows };
  } finally {
    for (const a of apps) await a.stop();
  }
}
