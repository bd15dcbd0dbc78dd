// The worker's reservation jobs with a settable clock: holds expire and give their quantity
// back, warnings and pickup reminders go out once, and the outbox survives an SMTP outage.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { refuseWrites } from "../helpers/engine";
import { call, request } from "../helpers/http";
import { createListing, createUser, listingQuantities } from "../factories";
import { POST as reserve } from "@/app/api/reservations/route";
import { POST as confirm } from "@/app/api/reservations/[id]/confirm/route";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { sendReservationReminders } from "@/lib/services/reservations/send-reservation-reminders";
import { DEFAULT_HOLD_MINUTES, SUPPLIER_REPLY_HOURS } from "@/lib/reservations/policy";
import { deliverOutbox } from "@/lib/mail/deliver-outbox";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { resetMailTransport } from "@/lib/mail/transport";
import { jobs } from "@/lib/worker/jobs";
import { db } from "@/db/index";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let gardener: { id: string };

beforeAll(async () => {
  ctx = await freshDb();
  gardener = await createUser({ roles: ["gardener"] });
});
afterAll(() => ctx.close());

const minutes = (n: number) => n * 60_000;
const hours = (n: number) => n * 3_600_000;
async function holdOne(listingId: string, quantity = 1, extra: Record<string, unknown> = {}) {
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: listingId, quantity, ...extra }, as: gardener.id }));
  expect(res.status).toBe(201);
  return res.json.reservation as { id: string; hold_expires_at: string; created_at: string };
}

describe("hold expiry", () => {
  it("expires an unanswered request after the supplier's 48 hours, not before, and gives the quantity back", async () => {
    expect(SUPPLIER_REPLY_HOURS).toBe(48);
    const l = await createListing({ quantity_total: 5 });
    const r = await holdOne(l.id, 3);
    const t0 = new Date(r.created_at).getTime();
    // Not after the 30 minutes a checkout gets: a free request waits for its supplier.
    expect(await expireHolds({ clock: () => new Date(t0 + minutes(DEFAULT_HOLD_MINUTES + 1)) })).toEqual({ expired: 0 });
    expect(await expireHolds({ clock: () => new Date(t0 + hours(47.9)) })).toEqual({ expired: 0 });
    expect((await listingQuantities(l.id)).quantity_held).toBe(3);
    expect(await expireHolds({ clock: () => new Date(t0 + hours(48) + 1000) })).toEqual({ expired: 1 });
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
    const row = await db()("reservations").first("status", "closed_at").where({ id: r.id });
    expect(row.status).toBe("expired");
    const history = await db()("reservation_events").where({ reservation_id: r.id }).orderBy("id").pluck("to_status");
    expect(history).toEqual(["held", "expired"]);
    // Run again (a restarted worker): nothing more happens.
    expect(await expireHolds({ clock: () => new Date(t0 + hours(60)) })).toEqual({ expired: 0 });
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
    const mail = await db()("email_outbox").where({ template: "reservation.expired" }).andWhere("dedupe_key", "like", `res:${r.id}:%`);
    // Nothing was owed, so the supplier was the one to act: both hear it ran out.
    expect(mail.map((m: any) => m.dedupe_key).sort()).toEqual([`res:${r.id}:expired:gardener`, `res:${r.id}:expired:supplier`]);
  });

  it("never expires a confirmed reservation", async () => {
    const l = await createListing({ quantity_total: 5 });
    const r = await holdOne(l.id, 2);
    await call(confirm, await request(`/api/reservations/${r.id}/confirm`, { as: l.owner_id, body: {} }), { id: r.id });
    expect(await expireHolds({ clock: () => new Date(Date.now() + minutes(120)) })).toEqual({ expired: 0 });
    expect((await db()("reservations").first("status").where({ id: r.id })).status).toBe("confirmed");
  });

  it("is the worker's expire-holds job, which takes the clock", async () => {
    const l = await createListing({ quantity_total: 5 });
    const r = await holdOne(l.id, 1);
    const job = jobs.find((j) => j.name === "expire-holds")!;
    await job.run({ clock: () => new Date(new Date(r.hold_expires_at).getTime() + 1) });
    expect((await db()("reservations").first("status").where({ id: r.id })).status).toBe("expired");
  });
});

describe("reminders", () => {
  it("reminds the supplier once, half-way through the time they have to answer", async () => {
    const l = await createListing({ quantity_total: 5 });
    const r = await holdOne(l.id);
    const t0 = new Date(r.created_at).getTime();
    const end = new Date(r.hold_expires_at).getTime();
    expect(end - t0).toBeCloseTo(hours(48), -4);
    expect((await sendReservationReminders({ clock: () => new Date(t0 + hours(23.5)) })).warned).toBe(0);
    expect((await sendReservationReminders({ clock: () => new Date(t0 + hours(24.1)) })).warned).toBe(1);
    // Once: not again later, nor ten minutes before the end as a checkout's hold would be.
    expect((await sendReservationReminders({ clock: () => new Date(t0 + hours(30)) })).warned).toBe(0);
    expect((await sendReservationReminders({ clock: () => new Date(end - minutes(9)) })).warned).toBe(0);
    const mail = await renderedRows(db()("email_outbox").where("dedupe_key", "like", `res:${r.id}:expiring:%`));
    expect(mail.map((m: any) => m.dedupe_key)).toEqual([`res:${r.id}:expiring:supplier:${r.hold_expires_at}`]);
    expect(mail[0].subject).toContain("Waiting for your answer");
  });

  it("reminds both sides the day before the pickup, once", async () => {
    const l = await createListing({ quantity_total: 5, windows: [{ kind: "dated", starts_at: new Date(Date.now() + 3 * 86_400_000).toISOString(), ends_at: new Date(Date.now() + 3 * 86_400_000 + 7_200_000).toISOString() }] });
    const r = await holdOne(l.id, 1, { pickup_window_id: l.window_ids[0] });
    await call(confirm, await request(`/api/reservations/${r.id}/confirm`, { as: l.owner_id, body: {} }), { id: r.id });
    const { pickup_at } = await db()("reservations").first("pickup_at").where({ id: r.id });
    const start = new Date(pickup_at).getTime();
    expect((await sendReservationReminders({ clock: () => new Date(start - 30 * 3_600_000) })).reminded).toBe(0);
    expect((await sendReservationReminders({ clock: () => new Date(start - 20 * 3_600_000) })).reminded).toBe(1);
    expect((await sendReservationReminders({ clock: () => new Date(start - 19 * 3_600_000) })).reminded).toBe(0);
    const mail = await renderedRows(db()("email_outbox").where("dedupe_key", "like", `res:${r.id}:reminder:%`).orderBy("dedupe_key"));
    expect(mail.map((m: any) => m.dedupe_key)).toEqual([`res:${r.id}:reminder:gardener`, `res:${r.id}:reminder:supplier`]);
    expect(mail[0].text_body).toContain("Secret Lane");
  });
});

describe("reminders with no fixed pickup time", () => {
  it("reminds both sides the day before the last day to collect, once, and never a posted culture", async () => {
    const l = await createListing({ quantity_total: 5 });
    const r = await holdOne(l.id);
    await call(confirm, await request(`/api/reservations/${r.id}/confirm`, { as: l.owner_id, body: {} }), { id: r.id });
    const row = await db()("reservations").first("pickup_at", "pickup_by").where({ id: r.id });
    expect(row.pickup_at).toBeNull();
    const deadline = new Date(row.pickup_by).getTime();
    // A second reservation, turned into a posted culture order: nobody collects it, so no reminder.
    const l2 = await createListing({ quantity_total: 5 });
    const posted = await holdOne(l2.id);
    await call(confirm, await request(`/api/reservations/${posted.id}/confirm`, { as: l2.owner_id, body: {} }), { id: posted.id });
    await db()("reservations").where({ id: posted.id }).update({ fulfilment: "post", pickup_by: row.pickup_by });

    // Other tests' reservations may fall due too, so this counts this reservation's own mail.
    const mine = () => db()("email_outbox").where("dedupe_key", "like", `res:${r.id}:reminder:%`).orderBy("dedupe_key");
    await sendReservationReminders({ clock: () => new Date(deadline - 30 * 3_600_000) });
    expect(await mine()).toHaveLength(0);
    expect((await sendReservationReminders({ clock: () => new Date(deadline - 20 * 3_600_000) })).reminded).toBeGreaterThanOrEqual(1);
    await sendReservationReminders({ clock: () => new Date(deadline - 19 * 3_600_000) });
    const mail = await renderedRows(mine());
    expect(mail.map((m: any) => m.dedupe_key)).toEqual([`res:${r.id}:reminder:gardener`, `res:${r.id}:reminder:supplier`]);
    expect(mail[0].subject).toMatch(/^Collect by tomorrow/);
    expect(mail[0].text_body).toContain("by arrangement");
    expect(await db()("email_outbox").where("dedupe_key", "like", `res:${posted.id}:reminder:%`)).toHaveLength(0);
  });
});

describe("a reminder that cannot be written", () => {
  it("is rolled back and tried again later, and does not stop the others", async () => {
    const start = new Date(Date.now() + 5 * 86_400_000);
    const window = { kind: "dated" as const, starts_at: start.toISOString(), ends_at: new Date(start.getTime() + 7_200_000).toISOString() };
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) {
      const l = await createListing({ quantity_total: 5, windows: [window] });
      const r = await holdOne(l.id, 1, { pickup_window_id: l.window_ids[0] });
      await call(confirm, await request(`/api/reservations/${r.id}/confirm`, { as: l.owner_id, body: {} }), { id: r.id });
      ids.push(r.id);
    }
    // Test-only: the outbox refuses the first reservation's reminders.
    const allow = await refuseWrites(db(), { name: "refuse_one_reminder", table: "email_outbox", event: "INSERT", when: `NEW.dedupe_key LIKE 'res:${ids[0]}:reminder:%'`, message: "refused for the test" });
    const quiet = console.error;
    console.error = () => {};
    try {
      await sendReservationReminders({ clock: () => new Date(start.getTime() - 20 * 3_600_000) });
    } finally {
      console.error = quiet;
    }
    const marked = async (id: string) => (await db()("reservations").first("pickup_reminded_at").where({ id })).pickup_reminded_at;
    expect(await marked(ids[0])).toBeNull();
    expect(await marked(ids[1])).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}/);
    expect(await marked(ids[2])).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}/);
    await allow();
    await sendReservationReminders({ clock: () => new Date(start.getTime() - 19 * 3_600_000) });
    expect(await marked(ids[0])).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}/);
    expect(await db()("email_outbox").where("dedupe_key", "like", `res:${ids[0]}:reminder:%`)).toHaveLength(2);
  });
});

describe("e-mail through an SMTP outage", () => {
  let smtp: SmtpFake;
  afterAll(async () => smtp?.close());

  it("delivers every reservation e-mail exactly once after the SMTP server comes back", async () => {
    smtp = await startSmtpFake();
    process.env.SMTP_PORT = String(smtp.smtpPort);
    resetMailTransport();
    // Clear what earlier tests queued, so this one counts only its own.
    const t0 = new Date();
    while ((await deliverOutbox({ clock: () => t0 })).sent > 0);
    const port = smtp.smtpPort;
    await smtp.close();

    const l = await createListing({ quantity_total: 9 });
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) ids.push((await holdOne(l.id)).id);
    for (const id of ids) await call(confirm, await request(`/api/reservations/${id}/confirm`, { as: l.owner_id, body: {} }), { id });
    const queued = await db()("email_outbox").where({ status: "pending" }).pluck("dedupe_key");
    // requested ×2 and confirmed ×2 per reservation.
    expect(queued).toHaveLength(12);

    const t1 = new Date();
    const down = await deliverOutbox({ clock: () => t1 });
    expect(down).toEqual({ sent: 0, failed: 1 }); // one refusal, and the rest wait for the server
    expect(await db()("email_outbox").where({ status: "pending", waiting_for: "smtp" })).toHaveLength(12);
    expect(await deliverOutbox({ clock: () => new Date(t1.getTime() + 1000) })).toEqual({ sent: 0, failed: 0 }); // still down: nothing tried

    smtp = await startSmtpFake({ smtpPort: port });
    resetMailTransport(); // forget the last "down" answer at once, rather than in a few seconds
    const later = new Date(t1.getTime() + 2000); // well inside the backoff: the server's return is what counts
    expect(await deliverOutbox({ clock: () => later })).toEqual({ sent: 12, failed: 0 });
    expect(await deliverOutbox({ clock: () => new Date(later.getTime() + 60_000) })).toEqual({ sent: 0, failed: 0 });

    // What arrived is exactly what was queued: each message once.
    const got = smtp.messages.map((m) => `${m.to[0]}|${m.subject}`).sort();
    const rows = await db()("email_outbox").whereIn("dedupe_key", queued);
    expect(got).toEqual(rows.map((m: any) => `${m.to_address}|${m.subject}`).sort());
    expect(rows.every((m: any) => m.status === "sent" && m.smtp_message_id)).toBe(true);
    expect(rows.map((m: any) => m.attempts).sort()).toEqual([...Array(11).fill(0), 1]); // one real try failed; the rest waited
    const confirmedForGardener = smtp.messages.filter((m) => m.subject.startsWith("Confirmed:"));
    expect(confirmedForGardener).toHaveLength(3);
    expect(confirmedForGardener.every((m) => m.text.includes("Secret Lane") && m.html?.includes("Secret Lane"))).toBe(true);
  });
});
