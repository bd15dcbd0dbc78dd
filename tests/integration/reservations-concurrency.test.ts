// The hold is one conditional UPDATE inside a transaction, so parallel requests can never
// hold more than exists: 200 requests for 1 unit of a 50-unit listing, fired by ten
// separate processes at the same SQLite file (each its own connection, as separate server
// processes would be), end with exactly 50 held. (Separate connections inside one process
// would not race: better-sqlite3 waits for a lock synchronously, stalling the whole thread.)
import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser, listingQuantities } from "../factories";
import { POST } from "@/app/api/reservations/route";

const run = promisify(execFile);
let ctx: Awaited<ReturnType<typeof freshDb>>;

beforeAll(async () => {
  ctx = await freshDb();
});
afterAll(() => ctx.close());

/** `processes` separate processes, each firing `perProcess` reservations at the same moment. */
async function burst(listingId: string, processes: number, perProcess: number, sizes: number[], gardeners: string[]): Promise<string[]> {
  const startAt = Date.now() + 4000; // time for every process to start and open its connection
  const script = path.resolve(__dirname, "../helpers/reserve-burst.ts");
  const env = { ...process.env, NODE_ENV: "test", ...ctx.env } as NodeJS.ProcessEnv;
  const outs = await Promise.all(
    Array.from({ length: processes }, () =>
      run(process.execPath, ["--conditions=react-server", "--import", "tsx", script, listingId, String(perProcess), String(startAt), sizes.join(","), gardeners.join(",")], { env, cwd: path.resolve(__dirname, "../.."), encoding: "utf8" }),
    ),
  );
  return outs.flatMap((o) => JSON.parse(o.stdout) as string[]);
}

const tally = (xs: (string | number)[]) => xs.reduce<Record<string, number>>((acc, o) => ({ ...acc, [o]: (acc[o] ?? 0) + 1 }), {});

describe("holding under contention", () => {
  it("200 parallel requests of 1 on a 50-unit listing from 10 processes hold exactly 50", async () => {
    const l = await createListing({ quantity_total: 50 });
    const gardeners = await Promise.all(Array.from({ length: 10 }, () => createUser({ roles: ["gardener"] })));
    const outcomes = await burst(l.id, 10, 20, [1], gardeners.map((g) => g.id));
    expect(tally(outcomes)).toEqual({ held: 50, insufficient_quantity: 150 });
    const q = await listingQuantities(l.id);
    expect(q.quantity_held).toBe(50);
    expect(q.quantity_held).toBeLessThanOrEqual(q.quantity_total);
    const [{ n, sum }] = await ctx.db("reservations").where({ listing_id: l.id }).count({ n: "*" }).sum({ sum: "quantity" });
    expect([Number(n), Number(sum)]).toEqual([50, 50]);
  }, 120_000);

  it("mixed sizes never overshoot: what is held adds up to the reservations made", async () => {
    const l = await createListing({ quantity_total: 37 });
    const g = await createUser({ roles: ["gardener"] });
    const outcomes = await burst(l.id, 6, 20, [1, 2, 3, 4], [g.id]);
    expect(outcomes.every((o) => o === "held" || o === "insufficient_quantity")).toBe(true);
    const q = await listingQuantities(l.id);
    const [{ sum }] = await ctx.db("reservations").where({ listing_id: l.id }).sum({ sum: "quantity" });
    expect(Number(sum)).toBe(q.quantity_held);
    expect(q.quantity_held).toBeLessThanOrEqual(37);
    expect(q.quantity_held).toBeGreaterThanOrEqual(34); // the last few units only fit a small request
  }, 120_000);

  it("through the route handler: 200 parallel POSTs of 1 on a 50-unit listing, 50 answered 201", async () => {
    const l = await createListing({ quantity_total: 50 });
    const g = await createUser({ roles: ["gardener"] });
    const reqs = await Promise.all(Array.from({ length: 200 }, () => request("/api/reservations", { body: { listing_id: l.id, quantity: 1 }, as: g.id })));
    const answers = await Promise.all(reqs.map((r) => call(POST, r)));
    expect(tally(answers.map((a) => a.status))).toEqual({ 201: 50, 409: 150 });
    expect(answers.filter((a) => a.status === 409).every((a) => a.json.error.code === "insufficient_quantity")).toBe(true);
    expect((await listingQuantities(l.id)).quantity_held).toBe(50);
  });
});
