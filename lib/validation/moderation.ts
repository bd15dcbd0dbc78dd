import { z } from "zod";
import { REQUESTABLE_ROLES } from "@/lib/auth/roles";
import { idSchema, noteSchema } from "./common";

export const roleDecisionSchema = z.object({
  role: z.enum(REQUESTABLE_ROLES, { error: "Choose the role being decided." }),
  decision: z.enum(["approve", "refuse"], { error: "Choose approve or refuse." }),
});

export const REPORT_REASONS = ["contaminated", "misdescribed", "no_show", "unsafe", "other"] as const;
export const REPORT_REASON_LABELS: Record<(typeof REPORT_REASONS)[number], string> = {
  contaminated: "Contaminated material (litter, plastic, sprays, disease)",
  misdescribed: "Not as described",
  no_show: "Did not turn up",
  unsafe: "Unsafe (a person, a place or the material)",
  other: "Something else",
};

/** A report is about exactly one listing or one person. */
export const reportSchema = z
  .object({
    listing_id: idSchema("a listing").optional(),
    user_id: idSchema("a person").optional(),
    reason: z.enum(REPORT_REASONS, { error: "Choose what is wrong." }),
    text: noteSchema(10, 2000).describe("What happened, in your words"),
  })
  .superRefine((r, ctx) => {
    if (!!r.listing_id === !!r.user_id) ctx.addIssue({ code: "custom", path: ["listing_id"], message: "Report either one listing or one person." });
  });

export const closeReportSchema = z.object({ note: noteSchema(3, 2000) });

export const listingModerationSchema = z.object({
  action: z.enum(["hide", "restore"], { error: "Choose hide or restore." }),
  note: noteSchema(3, 500),
  report_id: idSchema("a report").optional(),
});

export const userModerationSchema = z.object({
  action: z.enum(["suspend", "restore", "verify", "unverify"], { error: "Choose suspend, restore, verify or unverify." }),
  note: noteSchema(3, 500),
  report_id: idSchema("a report").optional(),
});

export const reportQueueQuerySchema = z.object({ status: z.enum(["open", "closed", "all"], { error: "Use open, closed or all." }).default("open") });

export const auditQuerySchema = z.object({
  action: z.string().trim().max(60, "At most 60 characters.").optional(),
  actor_id: z.string().trim().max(64).optional(),
  subject_type: z.string().trim().max(30).optional(),
  subject_id: z.string().trim().max(120).optional(),
  before_id: z.coerce.number({ error: "before_id must be a number" }).int("before_id must be whole").positive("before_id must be positive").optional(),
  limit: z.coerce.number({ error: "limit must be a number" }).int("limit must be whole").min(1, "limit of at least 1").max(500, "limit of at most 500").default(200),
});

export type ReportInput = z.infer<typeof reportSchema>;
