// The council, giveaway and moderation use-cases run against the context they are given: a
// caller's open transaction (everything they wrote goes when it rolls back) and a clock.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { createUser, giveawayBody } from "../factories";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { createGiveawaySchema } from "@/lib/validation/giveaways";
import { createGiveaway } from "@/lib/services/giveaways/create-giveaway";
import { councilDays } from "@/lib/services/giveaways/list-council-days";
import { fileReport } from "@/lib/services/moderation/file-report";
import { listReports } from "@/lib/services/moderation/list-reports";
import { inviteStaff } from "@/lib/services/council/invite-staff";
import { listInvites } from "@/lib/services/council/list-invites";
import { INVITE_TTL_DAYS } from "@/lib/council/invites";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let council: CouncilStaff;
let reporter: string;
let reported: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  const staff = await createUser({ roles: ["council"] });
  council = { userId: staff.id, organisationId: staff.organisation_id!, organisationName: "Fernhollow council", isOwner: true };
  reporter = (await createUser({ roles: ["gardener"] })).id;
  reported = (await createUser({ roles: ["supplier"] })).id;
});
afterAll(() => ctx.close());

class RolledBack extends Error {}

/** Runs `fn` in a transaction that is then rolled back; returns what `fn` returned. */
async function thenRollBack<T>(fn: (trx: typeof ctx.db) => Promise<T>): Promise<T> {
  let out: T | undefined;
  await expect(
    ctx.db.transaction(async (trx) => {
      out = await fn(trx);
      throw new RolledBack();
    }),
  ).rejects.toBeInstanceOf(RolledBack);
  return out as T;
}

describe("a use-case given a transaction", () => {
  it("makes and lists a giveaway day inside it, and the day is gone once it rolls back", async () => {
    const id = await thenRollBack(async (trx) => {
      const day = await createGiveaway(council, createGiveawaySchema.parse(giveawayBody()), { db: trx });
      expect((await councilDays(council, { db: trx })).map((d) => d.id)).toContain(day.id);
      return day.id;
    });
    expect((await councilDays(council)).map((d) => d.id)).not.toContain(id);
  });

  it("files a report inside it, and the moderators' queue no longer has it once it rolls back", async () => {
    const id = await thenRollBack(async (trx) => {
      const report = await fileReport(reporter, { user_id: reported, reason: "no_show", text: "Did not come to the agreed pickup." }, { db: trx });
      expect((await listReports("open", { db: trx })).map((r) => r.id)).toContain(report.id);
      return report.id;
    });
    expect((await listReports("open")).map((r) => r.id)).not.toContain(id);
  });
});

describe("a use-case given a clock", () => {
  it("dates an invitation from it, and lists it only while that clock says it is pending", async () => {
    const sent = new Date("2027-03-01T10:00:00.000Z");
    const invite = await inviteStaff(council, "Ada Fern", "colleague@example.test", { clock: () => sent });
    expect(invite.expires_at).toBe(new Date(sent.getTime() + INVITE_TTL_DAYS * 86_400_000).toISOString());
    const before = new Date(Date.parse(invite.expires_at) - 60_000);
    const after = new Date(Date.parse(invite.expires_at) + 60_000);
    expect((await listInvites(council, { clock: () => before })).map((i) => i.id)).toContain(invite.id);
    expect((await listInvites(council, { clock: () => after })).map((i) => i.id)).not.toContain(invite.id);
  });
});
