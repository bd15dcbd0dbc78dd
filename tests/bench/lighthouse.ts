// npm run lighthouse — Lighthouse 12 (mobile preset: a mid-range phone on a slow 4G link,
// simulated) in Debian's Chromium against the production build over the demo data: the home
// page, browse, a listing, the planner and a saved bed (signed in as the demo gardener).
// Prints one row per page with the targets of issue #15: performance ≥ 95, accessibility 100,
// first-load JavaScript ≤ 150 KB compressed, cumulative layout shift ≤ 0.05.
// Environment: CHROMIUM_PATH (default /usr/bin/chromium); LIGHTHOUSE_RUNS=3 to take each
// page's median performance of several runs (default 1).
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { execFile } from "node:child_process";
import { promisify } from "node:util";
import * as chromeLauncher from "chrome-launcher";
import { ROOT } from "../helpers/processes";
import { startApp } from "./server";
import { signIn } from "./sign-in";

const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const RUNS = Number(process.env.LIGHTHOUSE_RUNS ?? 1);
const FLAGS = ["--headless=new", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];
const TARGETS = { performance: 95, accessibility: 100, jsKb: 150, cls: 0.05 };

async function json<T>(url: string, cookie?: string): Promise<T> {
  const res = await fetch(url, { headers: cookie ? { cookie } : {} });
  if (!res.ok) throw new Error(`${url}: ${res.status}`);
  return (await res.json()) as T;
}

interface Audit {
  score: number | null;
  numericValue?: number;
  details?: { items?: { url: string; resourceType?: string; transferSize?: number }[] };
}
interface Lhr {
  categories: Record<string, { score: number | null; auditRefs?: { id: string; weight: number }[] }>;
  audits: Record<string, Audit>;
  runtimeError?: { message: string };
}

interface PageResult {
  name: string;
  path: string;
  performance: number;
  accessibility: number;
  lcpS: number;
  tbtMs: number;
  cls: number;
  jsKb: number;
  failing: string[];
}

/** Scripts the page loaded before it settled, as sent over the wire (compressed). */
function firstLoadJsKb(lhr: Lhr): number {
  const items = lhr.audits["network-requests"]?.details?.items ?? [];
  return items.filter((i) => i.resourceType === "Script").reduce((sum, i) => sum + (i.transferSize ?? 0), 0) / 1024;
}

const run = promisify(execFile);

/**
 * One Lighthouse run through its own command line, in plain Node: Lighthouse sends some of
 * its functions into the page as source, and this script's TypeScript loader would add a
 * helper to them that the page does not have.
 */
async function audit(port: number, url: string, cookie: string | undefined): Promise<Lhr> {
  const args = [url, `--port=${port}`, "--output=json", "--output-path=stdout", "--quiet", "--only-categories=performance,accessibility"];
  if (cookie) args.push(`--extra-headers=${JSON.stringify({ Cookie: cookie })}`);
  const { stdout } = await run(process.execPath, [path.join(ROOT, "node_modules/lighthouse/cli/index.js"), ...args], { maxBuffer: 64 * 1024 * 1024 });
  const lhr = JSON.parse(stdout) as Lhr;
  if (lhr.runtimeError) throw new Error(`${url}: ${lhr.runtimeError.message}`);
  return lhr;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function main() {
  if (!fs.existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM}: install Debian's chromium package or set CHROMIUM_PATH`);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "duffbank-lighthouse-"));
  const app = await startApp({ DATABASE_FILE: path.join(dir, "demo.sqlite") });
  const chrome = await chromeLauncher.launch({ chromePath: CHROMIUM, chromeFlags: FLAGS });
  try {
    const cookie = await signIn(app.base, "gardener@duffbank.test", "duffbank-demo");
    const { items } = await json<{ items: { id: string }[] }>(`${app.base}/api/listings`);
    const { items: beds } = await json<{ items: { id: string }[] }>(`${app.base}/api/beds`, cookie);
    if (!items.length || !beds.length) throw new Error("the demo has no listing or no saved bed to audit");
    const pages: { name: string; path: string; cookie?: string }[] = [
      { name: "home", path: "/" },
      { name: "browse", path: "/browse" },
      { name: "a listing", path: `/listings/${items[0].id}` },
      { name: "planner", path: "/plan" },
      { name: "a saved bed", path: `/beds/${beds[0].id}`, cookie },
    ];
    const results: PageResult[] = [];
    for (const page of pages) {
      // One unscored visit first, so the server has compiled and cached what the page needs.
      await fetch(`${app.base}${page.path}`, { headers: page.cookie ? { cookie: page.cookie } : {} });
      const runs: Lhr[] = [];
      for (let i = 0; i < RUNS; i++) runs.push(await audit(chrome.port, `${app.base}${page.path}`, page.cookie));
      const perf = runs.map((r) => Math.round(100 * (r.categories.performance.score ?? 0)));
      const lhr = runs[perf.indexOf(median(perf))];
      const failing = (lhr.categories.accessibility.auditRefs ?? [])
        .filter((ref) => ref.weight > 0 && (lhr.audits[ref.id]?.score ?? 1) < 1)
        .map((ref) => ref.id);
      results.push({
        name: page.name,
        path: page.path,
        performance: median(perf),
        accessibility: Math.round(100 * (lhr.categories.accessibility.score ?? 0)),
        lcpS: (lhr.audits["largest-contentful-paint"].numericValue ?? 0) / 1000,
        tbtMs: lhr.audits["total-blocking-time"].numericValue ?? 0,
        cls: lhr.audits["cumulative-layout-shift"].numericValue ?? 0,
        jsKb: firstLoadJsKb(lhr),
        failing,
      });
    }
    console.log(
      `\n[lighthouse] Lighthouse 12, mobile preset (simulated slow 4G, 4× CPU slowdown), production build, ${RUNS} run(s) a page (median performance); ` +
        `load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} cores\n`,
    );
    console.log("| page | performance | accessibility | LCP (s) | TBT (ms) | CLS | first-load JS (KB, compressed) | all targets met |");
    console.log("|---|---:|---:|---:|---:|---:|---:|---|");
    for (const r of results) {
      const met = r.performance >= TARGETS.performance && r.accessibility >= TARGETS.accessibility && r.jsKb <= TARGETS.jsKb && r.cls <= TARGETS.cls;
      console.log(`| ${r.name} (\`${r.path.replace(/[0-9a-f-]{36}/, ":id")}\`) | ${r.performance} | ${r.accessibility} | ${r.lcpS.toFixed(1)} | ${r.tbtMs.toFixed(0)} | ${r.cls.toFixed(3)} | ${r.jsKb.toFixed(0)} | ${met ? "yes" : "no"} |`);
    }
    for (const r of results.filter((x) => x.failing.length)) console.log(`[lighthouse] ${r.name}: accessibility audits not passed: ${r.failing.join(", ")}`);
    console.log(`[lighthouse] targets: performance ≥ ${TARGETS.performance}, accessibility ${TARGETS.accessibility}, first-load JS ≤ ${TARGETS.jsKb} KB, CLS ≤ ${TARGETS.cls}`);
  } finally {
    await chrome.kill();
    await app.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
