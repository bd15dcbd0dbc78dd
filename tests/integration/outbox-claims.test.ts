// The deliver-outbox job claims each message before sending it, so two workers running at
// once (a second `npm run worker`, or old and new during a deploy) never send one twice.
import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { resetMailTransport } from "@/lib/mail/transport";
import { enqueueEmail } from "@/db/outbox";
import { CLAIM_MS, deliverOutbox, retryDelayMs } from "@/lib/mail/deliver-outbox";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let smtp: SmtpFake;

beforeAll(async () => {
  ctx = await freshDb();
  smtp = await startSmtpFake();
  process.env.SMTP_PORT = String(smtp.smtpPort);
  resetMailTransport();
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});
beforeEach(async () => {
  await ctx.db("email_outbox").delete();
  smtp.messages.length = 0;
});

type Outcome = { sent: number; failed: number; rounds: number };

/** Two OS processes, each with its own database and SMTP connections, delivering at the same moment. */
async function deliverFromTwoWorkers(): Promise<Outcome[]> {
  const startAt = Date.now() + 5000;
  const outs = await Promise.all(
    [0, 1].map(() =>
      run(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/helpers/outbox-deliver-worker.ts"], {
        cwd: ROOT,
        env: { ...process.env, NODE_ENV: "test", DATABASE_FILE: ctx.file, SMTP_PORT: String(smtp.smtpPort), START_AT: String(startAt) },
        timeout: 90_000,
      }),
    ),
  );
  // If a process started late, the two did not really race: say so rather than pass quietly.
  expect(Date.now()).toBeGreaterThan(startAt);
  return outs.map((o) => JSON.parse(o.stdout) as Outcome);
}

describe("two deliver-outbox workers at once", () => {
  it("sends every message exactly once between them", async () => {
    const subjects = Array.from({ length: 45 }, (_, i) => `Message ${String(i).padStart(2, "0")}`);
    for (const subject of subjects) await enqueueEmail({ to: "pair@example.test", subject, text: "x", template: "test", dedupe_key: subject });

    const outcomes = await deliverFromTwoWorkers();

    const got = smtp.messages.map((m) => m.subject).sort();
    expect(got).toEqual(subjects); // each once: no duplicates, none missing
    expect(outcomes.reduce((n, o) => n + o.sent, 0)).toBe(subjects.length);
    expect(outcomes.every((o) => o.failed === 0)).toBe(true);
    const rows = await ctx.db("email_outbox").select("status", "attempts", "claimed_until");
    expect(rows).toHaveLength(subjects.length);
    expect(rows.every((r: { status: string; attempts: number; claimed_until: string | null }) => r.status === "sent" && r.attempts === 0 && r.claimed_until === null)).toBe(true);
  }, 120_000);
});

describe("the claim on one message", () => {
  it("leaves a message another worker holds a live claim on, and takes it over once the claim has run out", async () => {
    await enqueueEmail({ to: "held@example.test", subject: "Held elsewhere", text: "x", template: "test" });
    const t0 = new Date();
    // Another worker claimed it and has not finished (or died mid-send).
    await ctx.db("email_outbox").update({ claimed_until: new Date(t0.getTime() + CLAIM_MS).toISOString() });
    expect(await deliverOutbox(() => new Date(t0.getTime() + 1000))).toEqual({ sent: 0, failed: 0 });
    expect(smtp.messages).toHaveLength(0);

    expect(await deliverOutbox(() => new Date(t0.getTime() + CLAIM_MS + 1000))).toEqual({ sent: 1, failed: 0 });
    expect(smtp.messages.map((m) => m.subject)).toEqual(["Held elsewhere"]);
    const row = await ctx.db("email_outbox").first();
    expect(row).toMatchObject({ status: "sent", claimed_until: null });
  });

  it("clears the claim and keeps the backoff when the SMTP server refuses", async () => {
    const port = smtp.smtpPort;
    await smtp.close();
    try {
      await enqueueEmail({ to: "down@example.test", subject: "During an outage", text: "x", template: "test" });
      const t0 = new Date();
      expect(await deliverOutbox(() => t0)).toEqual({ sent: 0, failed: 1 });
      const row = await ctx.db("email_outbox").first();
      expect(row).toMatchObject({ status: "pending", attempts: 1, claimed_until: null, next_attempt_at: new Date(t0.getTime() + retryDelayMs(1)).toISOString() });
    } finally {
      smtp = await startSmtpFake({ smtpPort: port });
    }
    const later = new Date(Date.now() + retryDelayMs(1) + 1000);
    expect(await deliverOutbox(() => later)).toEqual({ sent: 1, failed: 0 });
    expect(smtp.messages.map((m) => m.subject)).toEqual(["During an outage"]);
  });
});
