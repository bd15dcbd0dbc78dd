// A deploy sends the worker SIGTERM in the middle of an outbox batch: it takes no new
// message, finishes the one in hand, lets go of its claims and its heartbeat, and exits well
// within the 20-second bound; the next worker delivers the rest at once. Every message
// arrives exactly once, within a minute.
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { startWorkerProcess, waitFor } from "../helpers/worker-process";
import { queueRendered } from "../helpers/outbox";
import { STOP_GRACE_MS } from "@/lib/worker/runner";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let smtp: SMTPServer;
const received: string[] = [];

beforeAll(async () => {
  ctx = await freshDb();
  // A slow mail server: each message takes a quarter of a second, so a batch takes seconds.
  smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, cb) {
      let raw = "";
      stream.on("data", (d) => (raw += d));
      stream.on("end", () =>
        setTimeout(() => {
          received.push(/^Subject: (.*)$/m.exec(raw)?.[1]?.trim() ?? "?");
          cb();
        }, 250),
      );
    },
  });
  await new Promise<void>((r) => smtp.listen(0, "127.0.0.1", () => r()));
});
afterAll(async () => {
  await new Promise<void>((r) => smtp.close(() => r()));
  await ctx.close();
});

describe("SIGTERM to a worker mid-batch", () => {
  it("delivers every message exactly once within a minute, across the stop and the next worker", async () => {
    const subjects = Array.from({ length: 40 }, (_, i) => `Deploy ${String(i).padStart(2, "0")}`);
    for (const subject of subjects) await queueRendered({ to: "deploy@example.test", subject, text: "x", dedupe_key: subject });
    const env = { ...ctx.env, SMTP_PORT: String((smtp.server.address() as AddressInfo).port) };
    const started = Date.now();

    const first = startWorkerProcess(env);
    await waitFor(() => received.length >= 3, 30_000, "the first worker to be sending");
    const stopped = await first.stop("SIGTERM");
    expect(stopped.code).toBe(0);
    expect(stopped.ms).toBeLessThan(STOP_GRACE_MS);
    expect(first.output()).toMatch(/stopped; released \d+ outbox claim/);
    const leftBehind = await ctx.db("email_outbox").where({ status: "pending" });
    expect(leftBehind.length).toBeGreaterThan(0); // it really was stopped mid-batch
    expect(leftBehind.filter((r: { claimed_until: string | null }) => r.claimed_until !== null)).toEqual([]); // no claim left to run out
    expect(await ctx.db("heartbeats").where({ kind: "worker" })).toHaveLength(0);

    const second = startWorkerProcess(env);
    await waitFor(async () => (await ctx.db("email_outbox").where({ status: "pending" })).length === 0, 60_000, "the second worker to finish");
    expect((await second.stop()).code).toBe(0);

    expect(Date.now() - started).toBeLessThan(60_000);
    expect([...received].sort()).toEqual(subjects); // each once: none twice, none missing
    const rows = await ctx.db("email_outbox").select("status", "smtp_message_id");
    expect(rows.every((r: { status: string; smtp_message_id: string | null }) => r.status === "sent" && r.smtp_message_id)).toBe(true);
  }, 90_000);
});
