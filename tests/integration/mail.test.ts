import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { resetMailTransport } from "@/lib/mail/transport";
import { queueRendered } from "../helpers/outbox";
import { enqueueEmail } from "@/db/outbox";
import { councilInviteEmail } from "@/lib/mail/templates/council-invite";
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
    await queueRendered({ to: "a@example.test", subject: "Hello <there>", text: "Plain body", html: "<p>HTML body</p>" });
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
    for (let i = 0; i < 3; i++) await queueRendered({ to: "b@example.test", subject: `Queued ${i}`, text: "x", dedupe_key: `q${i}` });
    await queueRendered({ to: "b@example.test", subject: "Queued 0", text: "x", dedupe_key: "q0" }); // same key: kept once
    const t0 = new Date();
    // The first refusal is enough: the others wait for the server instead of each failing in turn.
    expect(await deliverOutbox({ clock: () => t0 })).toEqual({ sent: 0, failed: 1 });
    const pending = await ctx.db("email_outbox").where({ status: "pending" }).orderBy("attempts", "desc");
    expect(pending).toHaveLength(3);
    expect(pending.every((p: any) => p.waiting_for === "smtp" && p.next_attempt_at === new Date(t0.getTime() + retryDelayMs(1)).toISOString())).toBe(true);
    expect(pending.map((p: any) => p.attempts)).toEqual([1, 0, 0]);
    expect(pending[0].last_error).toMatch(/\w/);

    smtp = await startSmtpFake({ smtpPort: port });
    // Back before the backoff is over: the next run finds the server answering and sends it all.
    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + 1000) })).toEqual({ sent: 3, failed: 0 });
    expect(await deliverOutbox({ clock: () => new Date(t0.getTime() + 2000) })).toEqual({ sent: 0, failed: 0 });
    const got = smtp.messages.filter((m) => m.to.includes("b@example.test")).map((m) => m.subject).sort();
    expect(got).toEqual(["Queued 0", "Queued 1", "Queued 2"]);
  });

  it("queues a template's name and data, not its text, and renders it when it sends it", async () => {
    const data = { organisation: "Marrowby Council", inviter: "Ada Fenn", url: "http://localhost:3000/council/join?token=abc%20def", expires: "Fri 8 Jan 2027, 17:00" };
    await enqueueEmail({ to: "c@example.test", template: "council_invite", data, dedupe_key: "invite-c" });
    const row = await ctx.db("email_outbox").first().where({ dedupe_key: "invite-c" });
    expect(row).toMatchObject({ template: "council_invite", subject: null, text_body: null, html_body: null });
    expect(JSON.parse(row.data)).toEqual(data);

    // The same message queued rendered, as rows were before: what arrives is the same, byte for byte.
    const before = councilInviteEmail(data);
    await queueRendered({ to: "c-old@example.test", ...before, template: "council_invite" });
    expect(await deliverOutbox()).toEqual({ sent: 2, failed: 0 });
    const [fromData] = smtp.messages.filter((m) => m.to.includes("c@example.test"));
    const [fromText] = smtp.messages.filter((m) => m.to.includes("c-old@example.test"));
    expect(fromData.subject).toBe("Join Marrowby Council on Duffbank");
    expect({ subject: fromData.subject, text: fromData.text, html: fromData.html }).toEqual({ subject: fromText.subject, text: fromText.text, html: fromText.html });
    expect(fromData.text).toContain("It works until Fri 8 Jan 2027, 17:00.");
    // Once sent, the row keeps the text it went out with.
    expect(await ctx.db("email_outbox").first("status", "subject", "text_body", "html_body").where({ dedupe_key: "invite-c" })).toEqual({
      status: "sent",
      subject: before.subject,
      text_body: before.text,
      html_body: before.html,
    });
  });

  it("fails a message it cannot render for good, says why on the row, and sends the rest", async () => {
    const now = new Date().toISOString();
    const row = (id: string, template: string, data: string) => ({ id, to_address: "d@example.test", template, data, status: "pending", attempts: 0, next_attempt_at: now, created_at: now });
    await ctx.db("email_outbox").insert([
      row("bad-name", "no.such_template", "{}"),
      row("bad-json", "account.confirm", "{not json"),
      row("bad-data", "reservation.confirmed", JSON.stringify({ to: "gardener" })),
    ]);
    await enqueueEmail({ to: "d@example.test", template: "account.password_changed", data: { signInUrl: "http://localhost:3000/sign-in" } });
    expect(await deliverOutbox()).toEqual({ sent: 1, failed: 3 });
    const failed = await ctx.db("email_outbox").whereIn("id", ["bad-name", "bad-json", "bad-data"]).orderBy("id").select("id", "status", "attempts", "last_error");
    expect(failed.map((f: any) => [f.id, f.status, f.attempts])).toEqual([["bad-data", "failed", 1], ["bad-json", "failed", 1], ["bad-name", "failed", 1]]);
    expect(failed.every((f: any) => f.last_error.startsWith("rendering failed:"))).toBe(true);
    expect(failed.find((f: any) => f.id === "bad-name").last_error).toContain('unknown e-mail template "no.such_template"');
    // Given up on: the next run does not try them again.
    expect(await deliverOutbox()).toEqual({ sent: 0, failed: 0 });
    expect(smtp.messages.filter((m) => m.to.includes("d@example.test")).map((m) => m.subject)).toEqual(["Your Duffbank password was changed"]);
  });

  it("backs off exponentially up to an hour", () => {
    expect(retryDelayMs(1)).toBe(30_000);
    expect(retryDelayMs(2)).toBe(60_000);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
