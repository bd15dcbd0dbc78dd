import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { createGiveaway, createUser } from "../factories";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let council: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  council = (await createUser({ roles: ["council"] })).id;
});
afterAll(() => ctx.close());

const halfHour = (n: number) => `${String(Math.floor(n / 2)).padStart(2, "0")}:${n % 2 ? "30" : "00"}`;

type Result = { ok: boolean; id?: string; code?: string; message?: string };

/** Several OS processes, each with its own connection to the same SQLite file, booking at the same moment. */
async function bookInParallel(dayId: string, perProcess: { userId: string; slotId: string; quantity: number }[][]): Promise<Result[]> {
  const startAt = Date.now() + 4000 + perProcess.length * 400;
  const outs = await Promise.all(
    perProcess.map((jobs) =>
      run(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/helpers/giveaway-book-worker.ts"], {
        cwd: ROOT,
        env: { ...process.env, NODE_ENV: "test", ...ctx.env, DAY_ID: dayId, START_AT: String(startAt), JOBS: JSON.stringify(jobs) },
        timeout: 90_000,
      }),
    ),
  );
  // If a process started late, the bookings did not really race: say so rather than pass quietly.
  expect(Date.now()).toBeGreaterThan(startAt);
  return outs.flatMap((o) => JSON.parse(o.stdout) as Result[]);
}

describe("booking a slot from many connections at once", () => {
  it("never puts more households in a slot than it holds", async () => {
    const day = await createGiveaway(council, { slots: [{ start: "09:00", end: "10:00", capacity: 15 }], household_cap: 3 });
    const slotId = day.slots[0].id;
    const households = await Promise.all(Array.from({ length: 48 }, () => createUser({ roles: ["gardener"] })));
    // 8 processes × 6 households = 48 requests for 15 places.
    const perProcess = Array.from({ length: 8 }, (_, p) => households.slice(p * 6, p * 6 + 6).map((h) => ({ userId: h.id, slotId, quantity: 1 })));
    const results = await bookInParallel(day.id, perProcess);

    const ok = results.filter((r) => r.ok);
    const refused = results.filter((r) => !r.ok);
    expect(results).toHaveLength(48);
    expect(ok).toHaveLength(15);
    // Every refusal is the clean 409, never a database error or a lock timeout.
    expect(refused.every((r) => r.code === "slot_full")).toBe(true);
    const slot = await ctx.db("giveaway_slots").where({ id: slotId }).first();
    expect(slot.booked).toBe(15);
    const [{ n }] = await ctx.db("giveaway_bookings").where({ slot_id: slotId, status: "booked" }).count({ n: "*" });
    expect(Number(n)).toBe(15);
    expect(await ctx.db("email_outbox").where({ template: "giveaway_booked" }).count({ n: "*" })).toEqual([{ n: 15 }]);
  }, 120_000);

  it("gives one household one booking a day, however many slots it tries at once", async () => {
    const day = await createGiveaway(council, {
      title: "Chip morning",
      material: "wood_chips",
      unit: "m3",
      household_cap: 1,
      // Six half-hour slots from 08:00.
      slots: Array.from({ length: 6 }, (_, i) => ({ start: halfHour(16 + i), end: halfHour(17 + i), capacity: 10 })),
    });
    const { id: household } = await createUser({ roles: ["gardener"] });
    const perProcess = day.slots.map((s) => [{ userId: household, slotId: s.id, quantity: 0.5 }]);
    const results = await bookInParallel(day.id, perProcess);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.filter((r) => !r.ok).every((r) => r.code === "household_limit")).toBe(true);
    const slots = await ctx.db("giveaway_slots").where({ day_id: day.id });
    expect(slots.reduce((n: number, s: { booked: number }) => n + s.booked, 0)).toBe(1);
  }, 120_000);
});
