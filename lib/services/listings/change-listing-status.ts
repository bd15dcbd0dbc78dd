import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findManagedListing, moveStatus } from "@/db/listings";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { planStatusChange, quantityLeft } from "@/lib/listings/status";
import type { ListingAction } from "@/lib/validation/listings";
import type { ListingStatus } from "@/db/types";
import { alertIfDue } from "@/lib/services/needs/alert-if-due";
import { resolveContext, type Context } from "@/lib/context";

/** Publish, pause, resume or archive. Asking for the state a listing is already in is a no-op. */
export async function changeListingStatus(userId: string, id: string, action: ListingAction, ctx: Context = {}): Promise<{ status: ListingStatus }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const result = await writeTransaction(q, async (trx) => {
    const row = await findManagedListing(id, userId, trx);
    if (!row) throw notFound("That listing");
    const ended = Boolean(row.available_until && Date.parse(row.available_until) <= now.getTime());
    // A listing past its end date is expired whether or not the worker has caught up.
    const current: ListingStatus = ended && (row.status === "active" || row.status === "paused") ? "expired" : row.status;
    const plan = planStatusChange(current, action, { left: quantityLeft(row), held: row.quantity_held, ended });
    if (!plan.ok) throw new ApiError("invalid_state", plan.message);
    if (plan.unchanged && current === row.status) return { status: row.status };
    // Conditional on the status read above, so two people acting at once cannot both apply.
    if (!(await moveStatus(id, [row.status], plan.to, trx))) throw new ApiError("conflict", "Someone else changed this listing just now. Reload and try again.");
    await recordAudit({ actor_id: userId, action: `listing.${action}`, subject_type: "listing", subject_id: id, before: { status: row.status }, after: { status: plan.to } }, trx);
    return { status: plan.to };
  });
  // Published or resumed: the open needs it could serve hear of it now.
  await alertIfDue(id, { db: q, clock });
  return result;
}
