import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { bookAs, createGiveaway, createListing, createUser } from "../factories";
import * as reports from "@/app/api/reports/route";
import * as queue from "@/app/api/moderation/reports/route";
import * as close from "@/app/api/moderation/reports/[id]/close/route";
import * as listingMod from "@/app/api/moderation/listings/[id]/route";
import * as userMod from "@/app/api/moderation/users/[id]/route";
import * as audit from "@/app/api/moderation/audit/route";
import { countVisibleListings, findVisibleListing } from "@/db/listing-status";
import * as browse from "@/app/api/listings/route";
import * as listingDetail from "@/app/api/listings/[id]/route";
import { authOptions } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { REPORTS_PER_DAY } from "@/lib/services/moderation/file-report";
import { rendered } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p: Record<string, string> = {};
let listing: string;

beforeAll(async () => {
  process.env.BCRYPT_COST = "4";
  ctx = await freshDb({ materials: true });
  p.mod = (await createUser({ roles: ["moderator"] })).id;
  p.reporter = (await createUser({ roles: ["gardener"] })).id;
  p.supplier = (await createUser({ roles: ["gardener", "supplier"], password_hash: await hashPassword("supplier password") })).id;
  p.gardener = (await createUser({ roles: ["gardener"] })).id;
  p.council = (await createUser({ roles: ["council"] })).id;
  listing = (await createListing({ owner_id: p.supplier, title: "Leaf bags, says no litter" })).id;
});
afterAll(() => ctx.close());

const nameOf = async (id: string) => (await ctx.db("users").first("display_name").where({ id })).display_name as string;
const report = async (as: string | null, body: unknown) => call(reports.POST as never, await request("/api/reports", { body, as }));
const modListing = async (as: string | null, id: string, body: unknown) => call(listingMod.POST as never, await request("/x", { body, as }), { id });
const modUser = async (as: string | null, id: string, body: unknown) => call(userMod.POST as never, await request("/x", { body, as }), { id });

describe("POST /api/reports", () => {
  it("files a report about a listing and one about a person", async () => {
    const a = await report(p.reporter, { listing_id: listing, reason: "contaminated", text: "Half the bags had crisp packets and cans in them." });
    expect(a.status).toBe(201);
    expect(a.json.report).toMatchObject({ subject_type: "listing", listing_id: listing, reason: "contaminated", status: "open" });
    const b = await report(p.reporter, { user_id: p.supplier, reason: "no_show", text: "Arranged a pickup twice and nobody was there." });
    expect(b.status).toBe(201);
    expect(b.json.report).toMatchObject({ subject_type: "user", user_id: p.supplier });
  });
  const BAD: [string, unknown, number, string | null][] = [
    ["neither a listing nor a person", { reason: "other", text: "Something is wrong here." }, 422, "listing_id"],
    ["both at once", { listing_id: "a", user_id: "b", reason: "other", text: "Something is wrong here." }, 422, "listing_id"],
    ["a reason not on the list", { listing_id: "a", reason: "rude", text: "Something is wrong here." }, 422, "reason"],
    ["too short to act on", { listing_id: "a", reason: "other", text: "bad" }, 422, "text"],
    ["an unknown listing", { listing_id: "no-such-listing", reason: "other", text: "Something is wrong here." }, 404, null],
    ["an unknown person", { user_id: "no-such-user", reason: "other", text: "Something is wrong here." }, 404, null],
  ];
  for (const [label, body, status, field] of BAD) {
    it(`${status} for ${label}`, async () => {
      const res = await report(p.reporter, body);
      expect(res.status).toBe(status);
      if (field) expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("refuses reports about yourself or your own listing, and visitors", async () => {
    expect((await report(p.supplier, { listing_id: listing, reason: "other", text: "Testing my own listing." })).status).toBe(422);
    expect((await report(p.supplier, { user_id: p.supplier, reason: "other", text: "Testing my own account." })).status).toBe(422);
    expect((await report(null, { listing_id: listing, reason: "other", text: "Something is wrong here." })).status).toBe(401);
  });
  it(`429 after ${REPORTS_PER_DAY} reports in a day from one account`, async () => {
    const { id } = await createUser({ roles: ["gardener"] });
    for (let i = 0; i < REPORTS_PER_DAY; i++) expect((await report(id, { user_id: p.gardener, reason: "other", text: `Report number ${i} about this.` })).status).toBe(201);
    expect((await report(id, { user_id: p.gardener, reason: "other", text: "One report too many." })).status).toBe(429);
  });
});

describe("the moderator queue", () => {
  it("shows each report with its context, only to moderators", async () => {
    const res = await call(queue.GET as never, await request("/api/moderation/reports", { as: p.mod }));
    expect(res.status).toBe(200);
    const r = res.json.items.find((i: { listing_id: string | null }) => i.listing_id === listing);
    expect(r).toMatchObject({ listing_title: "Leaf bags, says no litter", listing_status: "active", subject_user_id: p.supplier, reporter_id: p.reporter, reason: "contaminated" });
    expect(r.text).toContain("crisp packets");
    expect(r.subject_name).toBe(await nameOf(p.supplier));
    expect(r.reporter_name).toBe(await nameOf(p.reporter));
    for (const who of [p.gardener, p.council, p.supplier]) expect((await call(queue.GET as never, await request("/x", { as: who }))).status).toBe(403);
    expect((await call(queue.GET as never, await request("/api/moderation/reports?status=maybe", { as: p.mod }))).status).toBe(422);
  });
});

/** Every listing id browse returns near the test listings, page after page. */
async function browsed(): Promise<string[]> {
  const ids: string[] = [];
  let cursor: string | null = null;
  do {
    const res = await call(browse.GET as never, await request(`/api/listings?lat=52.2&lng=0.85&radius_km=5&limit=50${cursor ? `&cursor=${cursor}` : ""}`));
    expect(res.status).toBe(200);
    ids.push(...res.json.items.map((i: { id: string }) => i.id));
    cursor = res.json.next_cursor;
  } while (cursor);
  return ids;
}

describe("hiding a listing", () => {
  it("takes it out of every public listing query, and restoring brings it back", async () => {
    const visibleBefore = await countVisibleListings();
    expect(await findVisibleListing(listing)).toMatchObject({ id: listing, status: "active" });
    expect(await browsed()).toContain(listing);
    expect((await call(listingDetail.GET as never, await request(`/api/listings/${listing}`), { id: listing })).status).toBe(200);
    const res = await modListing(p.mod, listing, { action: "hide", note: "Contaminated with litter, per two reports." });
    expect(res.status).toBe(200);
    expect(res.json.listing.status).toBe("hidden");
    expect(await findVisibleListing(listing)).toBeUndefined();
    expect(await countVisibleListings()).toBe(visibleBefore - 1);
    // Browse (GET /api/listings, the listings work's own query) and the detail page's route
    // leave it out too; before hiding, both had it.
    expect(await browsed()).not.toContain(listing);
    expect((await call(listingDetail.GET as never, await request(`/api/listings/${listing}`), { id: listing })).status).toBe(404);
    expect((await modListing(p.mod, listing, { action: "hide", note: "Again." })).status).toBe(409);
    const back = await modListing(p.mod, listing, { action: "restore", note: "Owner cleaned the bags." });
    expect(back.json.listing.status).toBe("active");
    expect(await countVisibleListings()).toBe(visibleBefore);
    expect(await browsed()).toContain(listing);
    await modListing(p.mod, listing, { action: "hide", note: "Hidden again for the report below." });
  });
  it("is for moderators only, with a note, on a listing that exists", async () => {
    expect((await modListing(p.gardener, listing, { action: "restore", note: "I like it." })).status).toBe(403);
    expect((await modListing(p.mod, listing, { action: "restore" })).status).toBe(422);
    expect((await modListing(p.mod, listing, { action: "delete", note: "Gone." })).status).toBe(422);
    expect((await modListing(p.mod, "no-such-listing", { action: "hide", note: "Gone." })).status).toBe(404);
  });
});

describe("suspending, restoring and verifying accounts", () => {
  const provider = () =>
    authOptions.providers.find((x) => x.id === "credentials") as unknown as { options: { authorize: (c: Record<string, string>) => Promise<unknown> } };
  it("suspends an account: it can no longer sign in or book; restoring lets it back", async () => {
    const email = (await ctx.db("users").where({ id: p.supplier }).first()).email;
    expect(await provider().options.authorize({ email, password: "supplier password" })).toMatchObject({ email });
    const res = await modUser(p.mod, p.supplier, { action: "suspend", note: "Repeated no-shows and contaminated bags." });
    expect(res.status).toBe(200);
    expect(res.json.user).toMatchObject({ suspended: true });
    await expect(provider().options.authorize({ email, password: "supplier password" })).rejects.toThrow("suspended");
    const day = await createGiveaway(p.council);
    const booking = await bookAs(p.supplier, day.id, { slot_id: day.slots[0].id, quantity: 1 });
    expect(booking.status).toBe(403);
    expect(booking.json.error.code).toBe("suspended");
    expect((await modUser(p.mod, p.supplier, { action: "suspend", note: "Again." })).status).toBe(409);
    expect((await modUser(p.mod, p.supplier, { action: "restore", note: "Spoke to them." })).json.user.suspended).toBe(false);
    expect(await provider().options.authorize({ email, password: "supplier password" })).toMatchObject({ email });
    expect((await bookAs(p.supplier, day.id, { slot_id: day.slots[0].id, quantity: 1 })).status).toBe(201);
  });
  it("verifies a supplier, but not an account that gives nothing", async () => {
    const ok = await modUser(p.mod, p.supplier, { action: "verify", note: "Checked the farm in person." });
    expect(ok.json.user.verified).toBe(true);
    expect((await ctx.db("users").where({ id: p.supplier }).first()).verified_at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}/);
    expect((await modUser(p.mod, p.gardener, { action: "verify", note: "Seems nice." })).status).toBe(409);
    expect((await modUser(p.mod, p.mod, { action: "suspend", note: "Myself." })).status).toBe(409);
    expect((await modUser(p.council, p.supplier, { action: "unverify", note: "Not mine to do." })).status).toBe(403);
    expect((await modUser(p.mod, "no-such-user", { action: "suspend", note: "Nobody." })).status).toBe(404);
  });
});

describe("closing a report", () => {
  it("closes it with a note and tells the reporter the outcome, with what was done", async () => {
    const open = (await call(queue.GET as never, await request("/x", { as: p.mod }))).json.items.find((i: { listing_id: string | null }) => i.listing_id === listing);
    const res = await call(close.POST as never, await request("/x", { body: { note: "We hid the listing and spoke to the supplier." }, as: p.mod }), { id: open.id });
    expect(res.status).toBe(200);
    expect(res.json.report.status).toBe("closed");
    const mail = rendered(await ctx.db("email_outbox").where({ template: "report_outcome" }).first());
    const reporterEmail = (await ctx.db("users").where({ id: p.reporter }).first()).email;
    expect(mail.to_address).toBe(reporterEmail);
    expect(mail.text_body).toContain("We hid the listing and spoke to the supplier.");
    expect(mail.text_body).toContain("hid the listing");
    expect((await call(close.POST as never, await request("/x", { body: { note: "Twice." }, as: p.mod }), { id: open.id })).status).toBe(409);
    expect((await call(close.POST as never, await request("/x", { body: { note: "" }, as: p.mod }), { id: open.id })).status).toBe(422);
    expect((await call(close.POST as never, await request("/x", { body: { note: "Not mine." }, as: p.gardener }), { id: open.id })).status).toBe(403);
    expect((await call(close.POST as never, await request("/x", { body: { note: "Nothing." }, as: p.mod }), { id: "no-such-report" })).status).toBe(404);
  });
});

describe("the audit log", () => {
  it("lists moderator and council actions, newest first, filtered, for moderators only", async () => {
    const all = await call(audit.GET as never, await request("/api/moderation/audit", { as: p.mod }));
    expect(all.status).toBe(200);
    const actions = all.json.items.map((i: { action: string }) => i.action);
    expect(actions).toEqual(expect.arrayContaining(["listing.hide", "listing.restore", "user.suspend", "user.restore", "user.verify", "report.close", "giveaway.create"]));
    const ids = all.json.items.map((i: { id: number }) => i.id);
    expect(ids).toEqual([...ids].sort((a: number, b: number) => b - a));
    const hides = await call(audit.GET as never, await request(`/api/moderation/audit?action=listing.&subject_id=${listing}`, { as: p.mod }));
    expect(hides.json.items.every((i: { action: string; subject_id: string }) => i.action.startsWith("listing.") && i.subject_id === listing)).toBe(true);
    const first = hides.json.items.at(-1);
    expect(first).toMatchObject({ actor_id: p.mod, before: { status: "active" }, after: { status: "hidden" } });
    expect(first.actor_name).toBe(await nameOf(p.mod));
    const page = await call(audit.GET as never, await request("/api/moderation/audit?limit=2", { as: p.mod }));
    expect(page.json.items).toHaveLength(2);
    const next = await call(audit.GET as never, await request(`/api/moderation/audit?limit=2&before_id=${page.json.next_before_id}`, { as: p.mod }));
    expect(next.json.items[0].id).toBeLessThan(page.json.items[1].id + 1);
    expect((await call(audit.GET as never, await request("/api/moderation/audit?limit=0", { as: p.mod }))).status).toBe(422);
    expect((await call(audit.GET as never, await request("/x", { as: p.council }))).status).toBe(403);
  });

  it("cannot be changed or emptied: the database refuses, and no route or repository writes anything but inserts", async () => {
    const before = await ctx.db("audit_log").select("*").orderBy("id");
    expect(before.length).toBeGreaterThan(5);
    await expect(ctx.db("audit_log").where({ id: before[0].id }).update({ action: "forged" })).rejects.toThrow(/append-only/);
    await expect(ctx.db("audit_log").where({ id: before[0].id }).delete()).rejects.toThrow(/append-only/);

    // Every API route file: nothing under /api/moderation/audit answers anything but GET,
    // and no route file touches the table itself.
    const root = path.resolve(__dirname, "../../app/api");
    const files = routeFiles(root);
    for (const f of files) {
      const src = fs.readFileSync(f, "utf8");
      expect(src, f).not.toMatch(/audit_log/);
      if (f.includes(`${path.sep}audit${path.sep}`)) expect([...src.matchAll(/export const (\w+)/g)].map((m) => m[1])).toEqual(["GET"]);
    }
    // Every module that can write: only inserts into audit_log (the one writer is db/audit.ts recordAudit).
    for (const f of [...sourceFiles(path.resolve(__dirname, "../../db")), ...sourceFiles(path.resolve(__dirname, "../../lib"))]) {
      const src = fs.readFileSync(f, "utf8");
      expect(src, f).not.toMatch(/audit_log["'`]\)\s*(\.[a-zA-Z]+\([^)]*\)\s*)*\.(update|delete|del|truncate)\(/);
      expect(src, f).not.toMatch(/(UPDATE|DELETE FROM|TRUNCATE)\s+audit_log/i);
    }

    // And a round of the mutating routes above leaves every earlier row exactly as it was.
    await modListing(p.mod, listing, { action: "restore", note: "Final check." });
    await modUser(p.mod, p.supplier, { action: "unverify", note: "Final check." });
    const after = await ctx.db("audit_log").select("*").orderBy("id");
    expect(after.slice(0, before.length)).toEqual(before);
    expect(after.length).toBe(before.length + 2);
  });
});

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    return e.isDirectory() ? routeFiles(full) : e.name === "route.ts" ? [full] : [];
  });
}

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return e.name === "fakes" ? [] : sourceFiles(full);
    return /\.tsx?$/.test(e.name) ? [full] : [];
  });
}
