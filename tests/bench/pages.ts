// The signed-in pages of the demo with twenty times the demo's data (tests/bench/scale-demo.ts):
// each demo role signs in, and each page of theirs is loaded one request at a time, so the time
// is the server's own (rendering, queries), not time spent queueing behind other requests.
// Target (issue #15): every page under 300 ms at p95.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import knex from "knex";
import { sqliteConfig } from "@/knexfile";
import { seed } from "@/seeds/demo";
import { seedId } from "@/seeds/ids";
import { DEMO_PASSWORD } from "@/seeds/town";
import { scaleDemo } from "./scale-demo";
import { startApp } from "./server";
import { signIn } from "./sign-in";

const TIMES = Number(process.env.BENCH_PAGES_TIMES ?? 20);
const RUNS = Number(process.env.BENCH_PAGES_RUNS ?? 30);
const TARGET_MS = 300;

/** Each role's pages: what their navigation leads to, and the pages one step further. */
function pagesOf(bedId: string): Record<string, string[]> {
  return {
    gardener: ["/home", "/beds", `/beds/${bedId}`, `/beds/${bedId}/materials`, "/reservations", "/needs", "/profile"],
    supplier: ["/home", "/listings/mine", "/listings/new", "/requests", "/reports"],
    grower: ["/home", "/grower", "/requests"],
    council: ["/home", "/council", "/council/demand", "/reports"],
    moderator: ["/home", "/moderation", "/moderation/audit"],
  };
}

export interface PageRow {
  role: string;
  path: string;
  bytes: number;
  p50: number;
  p95: number;
  max: number;
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];

export async function runPagesBench(dir = os.tmpdir()): Promise<{ rows: PageRow[]; added: Record<string, number> }> {
  if (process.env.DATABASE_URL) throw new Error("the pages bench scales the demo in a SQLite file; run it without DATABASE_URL");
  const file = path.join(fs.mkdtempSync(path.join(dir, "duffbank-pages-")), "pages.sqlite");
  const k = knex(sqliteConfig(file));
  let added: Record<string, number>;
  try {
    await k.migrate.latest();
    await seed(k);
    added = await scaleDemo(k, TIMES);
  } finally {
    await k.destroy();
  }
  const app = await startApp({ DATABASE_FILE: file });
  const rows: PageRow[] = [];
  try {
    const bedId = seedId("bed:back-fence");
    for (const [role, paths] of Object.entries(pagesOf(bedId))) {
      const cookie = await signIn(app.base, `${role}@duffbank.test`, DEMO_PASSWORD);
      for (const p of paths) {
        const times: number[] = [];
        let bytes = 0;
        for (let i = 0; i < RUNS + 2; i++) {
          const t0 = performance.now();
          const res = await fetch(`${app.base}${p}`, { headers: { cookie }, redirect: "manual" });
          const body = await res.text();
          const ms = performance.now() - t0;
          if (res.status !== 200) throw new Error(`${role} ${p}: ${res.status}`);
          bytes = body.length;
          // The first two warm the route up (compiled code, caches).
          if (i >= 2) times.push(ms);
        }
        times.sort((a, b) => a - b);
        rows.push({ role, path: p, bytes, p50: quantile(times, 0.5), p95: quantile(times, 0.95), max: times[times.length - 1] });
      }
    }
  } finally {
    await app.stop();
  }
  return { rows, added };
}

export function pagesTable(r: { rows: PageRow[]; added: Record<string, number> }): string {
  const scale = Object.entries(r.added)
    .filter(([, n]) => n > 0)
    .map(([t, n]) => `${t} +${n.toLocaleString("en-US")}`)
    .join(", ");
  return [
    `[bench] signed-in pages with the demo ×${TIMES} (${scale}); ${RUNS} requests a page, one at a time; target p95 < ${TARGET_MS} ms`,
    "",
    "| role | page | HTML (KB) | p50 (ms) | p95 (ms) | max (ms) | met |",
    "|---|---|---:|---:|---:|---:|---|",
    ...r.rows.map((x) => `| ${x.role} | ${x.path} | ${(x.bytes / 1024).toFixed(0)} | ${x.p50.toFixed(0)} | ${x.p95.toFixed(0)} | ${x.max.toFixed(0)} | ${x.p95 < TARGET_MS ? "yes" : "no"} |`),
  ].join("\n");
}
