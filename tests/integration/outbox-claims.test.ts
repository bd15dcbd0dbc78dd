// The deliver-outbox job claims each message before sending it, so two workers running at
// once (a second `npm run worker`, or old and new during a deploy) never send one twice.
// E-mail exactly once, as far as SMTP allows: a message the server accepted is recorded as a
// step of its own, and a failure to record it is retried as a mark, never as a second send;
// claims are short and let go at shutdown; a mail server that hangs or refuses does not hold
// the worker, and a message the server refuses for good is not tried for two days.
import { execFile } from "node:child_process";
import net, { type AddressInfo } from "node:net";
import path from "node:path";
import { promisify } from "node:util";
import { SMTPServer } from "smtp-server";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { refuseWrites } from "../helpers/engine";
import { startSilentServer } from "../helpers/ports";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { resetMailTransport, SMTP_TIMEOUTS } from "@/lib/mail/transport";
import { releaseClaims } from "@/db/outbox";
import { queueRendered } from "../helpers/outbox";
import { CLAIM_MS, deliverOutbox, messagesInFlight, retryDelayMs } from "@/lib/mail/deliver-outbox";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");

let ctx: Awaited<ReturnType<typeof freshDb>>;
let smtp: SmtpFake;

function useSmtpPort(port: number) {
  process.env.SMTP_PORT = String(port);
  resetMailTransport();
}

beforeAll(async () => {
  ctx = await freshDb();
  smtp = await startSmtpFake();
  useSmtpPort(smtp.smtpPort);
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});
beforeEach(async () => {
  await ctx.db("email_outbox").delete();
  smtp.messages.length = 0;
  useSmtpPort(smtp.smtpPort);
});

const queue = async (n: number, prefix: string, to = "someone@example.test") => {
  for (let i = 0; i < n; i++) await queueRendered({ to, subject: `${prefix} ${i}`, text: "x", dedupe_key: `${prefix}-${i}` });
};

type Outcome = { sent: number; failed: number; rounds: number };

/** Two OS processes, each with its own database and SMTP connections, delivering at the same moment. */
async function deliverFromTwoWorkers(): Promise<Outcome[]> {
  const startAt = Date.now() + 5000;
  const outs = await Promise.all(
    [0, 1].map(() =>
      run(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/helpers/outbox-deliver-worker.ts"], {
        cwd: ROOT,
        env: { ...process.env, NODE_ENV: "test", ...ctx.env, SMTP_PORT: String(smtp.smtpPort), START_AT: String(startAt) },
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
    for (const subject of subjects) await queueRendered({ to: "pair@example.test", subject, text: "x", dedupe_key: subject });

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
    await queueRendered({ to: "held@example.test", subject: "Held elsewhere", text: "x" });
    const t0 = new Date();
    // Another worker claimed it and has not finished (or died mid-send).
    await ctx.db("email_outbox").update({ claimed_until: new Date(t0.getTime() + CLAIM_MS).toISOString() });
    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + 1000) })).toEqual({ sent: 0, failed: 0 });
    expect(smtp.messages).toHaveLength(0);

    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + CLAIM_MS + 1000) })).toEqual({ sent: 1, failed: 0 });
    expect(smtp.messages.map((m) => m.subject)).toEqual(["Held elsewhere"]);
    const row = await ctx.db("email_outbox").first();
    expect(row).toMatchObject({ status: "sent", claimed_until: null });
  });

  it("clears the claim and keeps the backoff when the SMTP server refuses", async () => {
    const port = smtp.smtpPort;
    await smtp.close();
    try {
      await queueRendered({ to: "down@example.test", subject: "During an outage", text: "x" });
      const t0 = new Date();
      expect(await deliverOutbox({ clock: () => t0 })).toEqual({ sent: 0, failed: 1 });
      const row = await ctx.db("email_outbox").first();
      expect(row).toMatchObject({ status: "pending", attempts: 1, claimed_until: null, next_attempt_at: new Date(t0.getTime() + retryDelayMs(1)).toISOString() });
    } finally {
      smtp = await startSmtpFake({ smtpPort: port });
    }
    const later = new Date(Date.now() + retryDelayMs(1) + 1000);
    expect(await deliverOutbox({ clock: () => later })).toEqual({ sent: 1, failed: 0 });
    expect(smtp.messages.map((m) => m.subject)).toEqual(["During an outage"]);
  });
});

describe("recording a send", () => {
  it("retries a failed mark as a mark: the accepted message is never handed to SMTP again", async () => {
    await queue(1, "Marked later");
    // The database refuses the "sent" mark (a read-only or full disk for a moment).
    const allowMark = await refuseWrites(ctx.db, { name: "refuse_mark", table: "email_outbox", event: "UPDATE", when: "NEW.status = 'sent'", message: "disk I/O error" });
    const t0 = new Date();
    expect(await deliverOutbox({ clock: () => t0 })).toEqual({ sent: 1, failed: 0 });
    expect(smtp.messages).toHaveLength(1);
    expect(messagesInFlight()).toHaveLength(1);
    // Still refused: the next runs try the mark only, and send nothing else meanwhile.
    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + 2000) })).toEqual({ sent: 0, failed: 0 });
    await allowMark();
    // Later than the claim would last: the mark still comes first, and nothing is sent twice.
    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + CLAIM_MS + 5000) })).toEqual({ sent: 0, failed: 0 });
    expect(smtp.messages).toHaveLength(1);
    expect(messagesInFlight()).toHaveLength(0);
    const row = await ctx.db("email_outbox").first();
    expect(row).toMatchObject({ status: "sent", attempts: 0, claimed_until: null, claimed_by: null });
    expect(row.smtp_message_id).toMatch(/^<.+@.+>/); // the Message-ID the server accepted, with its reply
    expect(row.sent_at).toBe(t0.toISOString()); // when the server accepted it, not when it was marked
  });

  it("holds a claim for minutes, not a quarter of an hour", () => {
    expect(CLAIM_MS).toBeLessThanOrEqual(5 * 60_000);
    expect(CLAIM_MS).toBeGreaterThan(SMTP_TIMEOUTS.connectionTimeout + SMTP_TIMEOUTS.greetingTimeout + SMTP_TIMEOUTS.socketTimeout);
  });

  it("lets go of a stopped worker's claims, so the message goes out at once elsewhere", async () => {
    await queue(2, "Held by a stopping worker");
    const now = new Date();
    await ctx.db("email_outbox").update({ claimed_until: new Date(now.getTime() + CLAIM_MS).toISOString(), claimed_by: "worker:old" });
    expect(await deliverOutbox({ clock: () => now })).toEqual({ sent: 0, failed: 0 });
    expect(await releaseClaims("worker:someone-else")).toBe(0); // only its own
    expect(await releaseClaims("worker:old")).toBe(2);
    expect(await deliverOutbox({ clock: () => now })).toEqual({ sent: 2, failed: 0 });
    expect(smtp.messages.map((m) => m.subject).sort()).toEqual(["Held by a stopping worker 0", "Held by a stopping worker 1"]);
  });
});

describe("the job's context", () => {
  it("claims nothing once the worker is stopping, and names the worker on the claims it makes", async () => {
    await queue(1, "Named");
    expect(await deliverOutbox({ signal: AbortSignal.abort() })).toEqual({ sent: 0, failed: 0 });
    expect(smtp.messages).toHaveLength(0);
    expect(await ctx.db("email_outbox").first("status", "claimed_by")).toEqual({ status: "pending", claimed_by: null });
    // The "sent" mark is refused, so the claim the run made stays on the row to be read.
    const allowMark = await refuseWrites(ctx.db, { name: "refuse_named_mark", table: "email_outbox", event: "UPDATE", when: "NEW.status = 'sent'", message: "disk I/O error" });
    expect(await deliverOutbox({ workerId: "worker:named" })).toEqual({ sent: 1, failed: 0 });
    expect(await ctx.db("email_outbox").first("status", "claimed_by")).toEqual({ status: "pending", claimed_by: "worker:named" });
    await allowMark();
    expect(await deliverOutbox({ workerId: "worker:named" })).toEqual({ sent: 0, failed: 0 });
    expect(messagesInFlight()).toHaveLength(0);
    expect(await ctx.db("email_outbox").first("status", "claimed_by")).toEqual({ status: "sent", claimed_by: null });
  });
});

describe("a mail server that is not answering", () => {
  it("hangs: one short timeout, then the batch moves on and the rest wait for the server", async () => {
    const silent = await startSilentServer(); // takes the connection, never greets
    try {
      useSmtpPort(silent.port);
      await queue(5, "Into the void");
      const started = Date.now();
      const t0 = new Date();
      expect(await deliverOutbox({ clock: () => t0 })).toEqual({ sent: 0, failed: 1 });
      const took = Date.now() - started;
      expect(took).toBeLessThan(SMTP_TIMEOUTS.greetingTimeout + SMTP_TIMEOUTS.connectionTimeout + 2000);
      const rows = await ctx.db("email_outbox").orderBy("attempts", "desc");
      expect(rows.map((r: { attempts: number }) => r.attempts)).toEqual([1, 0, 0, 0, 0]);
      expect(rows.every((r: { waiting_for: string; claimed_until: string | null }) => r.waiting_for === "smtp" && r.claimed_until === null)).toBe(true);
      // While it stays silent, later runs cost one quick question, not a timeout per message.
    } finally {
      await silent.close();
    }
    useSmtpPort(smtp.smtpPort);
    expect(await deliverOutbox({ clock: () => new Date() })).toEqual({ sent: 5, failed: 0 });
  }, 30_000);

  it("answers the question but hangs up on every send: the tries stay spaced out", async () => {
    // Greets and answers EHLO (so it looks alive), then hangs up as soon as a message starts.
    const flaky = net.createServer((socket) => {
      socket.write("220 flaky ESMTP\r\n");
      socket.on("data", (d) => {
        const line = d.toString();
        if (/^(EHLO|HELO)/i.test(line)) socket.write("250 flaky\r\n");
        else if (/^QUIT/i.test(line)) socket.end("221 bye\r\n");
        else socket.destroy();
      });
    });
    await new Promise<void>((r) => flaky.listen(0, "127.0.0.1", r));
    try {
      useSmtpPort((flaky.address() as AddressInfo).port);
      await queue(2, "Never lands");
      expect(await deliverOutbox()).toEqual({ sent: 0, failed: 1 }); // the first send, then all wait
      expect(await deliverOutbox()).toEqual({ sent: 0, failed: 1 }); // it answers again: one more try
      expect(await deliverOutbox()).toEqual({ sent: 0, failed: 0 }); // answering is no longer enough for a while
      const tries = await ctx.db("email_outbox").sum<{ n: number }[]>({ n: "attempts" });
      expect(Number(tries[0].n)).toBe(2);
    } finally {
      await new Promise<void>((r) => flaky.close(() => r()));
    }
  });

  it("refuses a recipient for good: that message fails at once, the others go", async () => {
    const strict = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS"],
      logger: false,
      onRcptTo(address, _session, cb) {
        if (address.address.startsWith("gone@")) cb(Object.assign(new Error("5.1.1 No such mailbox"), { responseCode: 550 }));
        else cb();
      },
      onData(stream, _session, cb) {
        stream.resume();
        stream.on("end", () => cb());
      },
    });
    await new Promise<void>((r) => strict.listen(0, "127.0.0.1", () => r()));
    try {
      useSmtpPort((strict.server.address() as AddressInfo).port);
      await queue(1, "Bounces", "gone@example.test");
      await queue(2, "Arrives");
      expect(await deliverOutbox()).toEqual({ sent: 2, failed: 1 });
      const bounced = await ctx.db("email_outbox").first().where({ to_address: "gone@example.test" });
      expect(bounced).toMatchObject({ status: "failed", attempts: 1, waiting_for: null });
      expect(bounced.last_error).toMatch(/550/);
    } finally {
      await new Promise<void>((r) => strict.close(() => r()));
    }
  });
});
