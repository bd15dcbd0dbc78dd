import "server-only";
import { findOwnNeed, updateOwnNeed, type NeedPatch } from "@/db/needs";
import { isUniqueViolation } from "@/db/dialect";
import { ApiError, notFound } from "@/lib/api/errors";
import { MATERIALS } from "@/lib/calc/facts";
import { NEED_UNIT_LABEL, NEED_UNITS } from "@/lib/match/units";
import { reachBand } from "@/lib/needs/reach";
import { effectiveNeedStatus, type NeedView } from "@/lib/needs/view";
import { neededByIssue, type UpdateNeedInput } from "@/lib/validation/needs";
import { resolveContext, type Context } from "@/lib/context";
import { dayOf } from "@/lib/services/needs/steps/day-of";
import { needViews } from "@/lib/services/needs/steps/need-views";
import { noticeListingsQuietly } from "@/lib/services/needs/notice-listings-quietly";

const invalid = (field: string, message: string) => new ApiError("invalid_input", "Some fields need another look.", { [field]: message });

/**
 * PATCH /api/needs/:id: change an open need, close it by hand, or open a closed, met or
 * expired one again (with a date still to come). Anyone else's need is a 404.
 */
export async function changeNeed(userId: string, id: string, patch: UpdateNeedInput, ctx: Context = {}): Promise<NeedView> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const today = dayOf(now);
  const row = await findOwnNeed(id, userId, q);
  if (!row) throw notFound("That need");
  if (patch.material !== undefined && patch.material !== row.material_code) {
    throw invalid("material", `This need is for ${MATERIALS[row.material_code].name.toLowerCase()}; a need's material cannot change: open a new need for ${MATERIALS[patch.material].name.toLowerCase()}.`);
  }
  const current = effectiveNeedStatus(row, today);
  const reopening = patch.status === "open" && current !== "open";
  const edits = patch.quantity !== undefined || patch.unit !== undefined || patch.radius_km !== undefined || patch.needed_by !== undefined || patch.location !== undefined || patch.alerts !== undefined;
  if (edits && current !== "open" && !reopening) throw new ApiError("invalid_state", `This need is ${current}: open it again (status "open") to change it.`);

  const changes: NeedPatch = {};
  if (patch.quantity !== undefined) changes.quantity = patch.quantity;
  if (patch.unit !== undefined) {
    if (!NEED_UNITS[row.material_code].includes(patch.unit)) {
      throw invalid("unit", `${MATERIALS[row.material_code].name} is measured in ${NEED_UNITS[row.material_code].map((u) => NEED_UNIT_LABEL[u]).join(" or ")}, not ${NEED_UNIT_LABEL[patch.unit]}`);
    }
    changes.unit = patch.unit;
  }
  if (patch.radius_km !== undefined) Object.assign(changes, { radius_km: patch.radius_km, reach_km: reachBand(patch.radius_km) });
  if (patch.location !== undefined) Object.assign(changes, { lat: patch.location.lat, lng: patch.location.lng });
  if (patch.alerts !== undefined) changes.alerts = patch.alerts;
  if (patch.needed_by !== undefined) {
    const issue = neededByIssue(patch.needed_by, now);
    if (issue) throw invalid("needed_by", issue);
    changes.needed_by = patch.needed_by;
  }
  if (reopening && (changes.needed_by ?? row.needed_by) < today) throw invalid("needed_by", "Its date has passed: give a new needed_by to open it again.");
  if (patch.status === "closed" && current === "open") Object.assign(changes, { status: "closed", closed_at: now.toISOString() });
  if (reopening) Object.assign(changes, { status: "open", closed_at: null });

  if (Object.keys(changes).length) {
    try {
      await updateOwnNeed(id, userId, changes, now.toISOString(), q);
    } catch (err) {
      if (isUniqueViolation(err)) throw new ApiError("conflict", "This bed already has another open need for that material.");
      throw err;
    }
  }
  const after = (await findOwnNeed(id, userId, q))!;
  // Somewhere new, further, later, measured otherwise or open again: listings already on offer may serve it now.
  if (reopening || changes.lat !== undefined || changes.radius_km !== undefined || changes.needed_by !== undefined || changes.unit !== undefined) {
    await noticeListingsQuietly(after, { db: q, clock });
  }
  return (await needViews([after], q, now))[0];
}
