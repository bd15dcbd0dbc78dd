import { describe, expect, it } from "vitest";
import { groupReports } from "@/lib/moderation/group-reports";
import { auditSentence, changeLines } from "@/lib/moderation/audit-words";

const report = (id: string, over: { listing_id?: string | null; subject_user_id?: string | null; created_at: string }) => ({ id, listing_id: null, subject_user_id: null, ...over });

describe("reports grouped by what they are about", () => {
  it("ten reports on one listing are one group of ten, oldest first; a person's reports are their own group", () => {
    const rows = [
      ...Array.from({ length: 10 }, (_, i) => report(`l${i}`, { listing_id: "L1", subject_user_id: "owner", created_at: `2026-11-0${Math.min(9, i + 1)}T10:0${i}:00Z` })).reverse(),
      report("u1", { subject_user_id: "P1", created_at: "2026-11-05T00:00:00Z" }),
      report("u2", { subject_user_id: "P1", created_at: "2026-11-04T00:00:00Z" }),
    ];
    const groups = groupReports(rows);
    expect(groups.map((g) => [g.key, g.reports.length])).toEqual([
      ["listing:L1", 10],
      ["user:P1", 2],
    ]);
    expect(groups[0].reports[0].id).toBe("l0");
    expect(groups[1].reports.map((r) => r.id)).toEqual(["u2", "u1"]);
  });
});

describe("the audit log in words", () => {
  it("says who did what to what", () => {
    expect(auditSentence({ action: "listing.hide", subject_type: "listing", subject_id: "x", subject_name: "Bagged oak leaves", actor_name: "Sol Ferreira" })).toBe("Sol Ferreira hid the listing “Bagged oak leaves”");
    expect(auditSentence({ action: "user.suspend", subject_type: "user", subject_id: "x", subject_name: "Rowan Pike", actor_name: "Sol Ferreira" })).toBe("Sol Ferreira suspended Rowan Pike");
    expect(auditSentence({ action: "giveaway.slot_resize", subject_type: "giveaway_slot", subject_id: "x", subject_name: null, actor_name: null })).toBe("Duffbank changed how many households a time slot takes");
  });
  it("an action it has no words for still reads without its dotted code", () => {
    expect(auditSentence({ action: "listing.frobnicate_twice", subject_type: "listing", subject_id: "x", actor_name: "A" })).toBe("A frobnicate twice on the listing");
  });
  it("shows stored values as field and value lines", () => {
    expect(changeLines(JSON.stringify({ status: "hidden", note: "Sorting the bags", report_id: null }))).toEqual([
      { field: "Status", value: "hidden" },
      { field: "Note", value: "Sorting the bags" },
      { field: "Report", value: "—" },
    ]);
    expect(changeLines(JSON.stringify(["title", "quantity_total"]))).toEqual([{ field: "Fields", value: "Title, quantity total" }]);
    expect(changeLines(null)).toEqual([]);
  });
});
