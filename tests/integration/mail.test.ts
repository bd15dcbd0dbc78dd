import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { resetMailTransport } from "@/lib/mail/transport";
import { enqueueEmail } from "@/db/outbox";
import { deliverOutbox, retryDelayMs } from "@/lib/mail/deliver-outbox";

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

describe("the local SMTP fake and its inbox", () => {
  it("keeps what it receives and serves it as JSON and HTML", async () => {
    await enqueueEmail({ to: "a@example.test", subject: "Hello <there>", text: "Plain body", html: "<p>HTML body</p>", template: "test" });
    expect(await deliverOutbox()).toEqual({ sent: 1, failed: 0 });
    const json = await (await fetch(`${smtp.inboxUrl}/messages.json?to=a@example.test`)).json();
    expect(json.messages).toHaveLength(1);
    expect(json.messages[0]).toMatchObject({ subject: "Hello <there>", to: ["a@example.test"] });
    expect(json.messages[0].text.trim()).toBe("Plain body");
    const page = await (await fetch(smtp.inboxUrl)).text();
    expect(page).toContain("Hello &lt;there&gt;");
  });

  it("loses nothing while the SMTP server is down, and sends each message once when it is back", async () => {
    const port = smtp.smtpPort;
    await smtp.close();
    for (let i = 0; i < 3; i++) await enqueueEmail({ to: "b@example.test", subject: `Queued ${i}`, text: "x", template: "test", dedupe_key: `q${i}` });
    await enqueueEmail({ to: "b@example.test", subject: "Queued 0", text: "x", template: "test", dedupe_key: "q0" }); // same key: kept once
    const t0 = new Date();
    // The first refusal is enough: the others wait for the server instead of each failing in turn.
    expect(await deliverOutbox(() => t0)).toEqual({ sent: 0, failed: 1 });
    const pending = await ctx.db("email_outbox").where({ status: "pending" }).orderBy("attempts", "desc");
    expect(pending).toHaveLength(3);
    expect(pending.every((p: any) => p.waiting_for === "smtp" && p.next_attempt_at === new Date(t0.getTime() + retryDelayMs(1)).toISOString())).toBe(true);
    expect(pending.map((p: any) => p.attempts)).toEqual([1, 0, 0]);
    expect(pending[0].last_error).toMatch(/\w/);

    smtp = await startSmtpFake({ smtpPort: port });
    // Back before the backoff is over: the next run finds the server answering and sends it all.
    expect(await deliverOutbox(() => new Date(t0.getTime() + 1000))).toEqual({ sent: 3, failed: 0 });
    expect(await deliverOutbox(() => new Date(t0.getTime() + 2000))).toEqual({ sent: 0, failed: 0 });
    const got = smtp.messages.filter((m) => m.to.includes("b@example.test")).map((m) => m.subject).sort();
    expect(got).toEqual(["Queued 0", "Queued 1", "Queued 2"]);
  });

  it("backs off exponentially up to an hour", () => {
    expect(retryDelayMs(1)).toBe(30_000);
    expect(retryDelayMs(2)).toBe(60_000);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
