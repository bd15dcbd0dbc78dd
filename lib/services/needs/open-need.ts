import "server-only";
import { findBed } from "@/db/beds";
import { newId } from "@/db/index";
import { isUniqueViolation } from "@/db/dialect";
import { insertNeed } from "@/db/needs";
import type { NeedRow } from "@/db/types";
import { ApiError } from "@/lib/api/errors";
import { NEED_UNITS } from "@/lib/match/units";
import { reachBand } from "@/lib/needs/reach";
import type { NeedView } from "@/lib/needs/view";
import { addDays } from "@/lib/time/zoned";
import { neededByIssue, type OpenNeedInput } from "@/lib/validation/needs";
import { resolveContext, type Context } from "@/lib/context";
import { dayOf } from "@/lib/services/needs/steps/day-of";
import { needViews } from "@/lib/services/needs/steps/need-views";
import { noticeListingsQuietly } from "@/lib/services/needs/notice-listings-quietly";

/** A need with no date of its own, and no bed day to borrow, runs this long (a product choice: a season's planning). */
export const DEFAULT_NEED_DAYS = 56;

/**
 * POST /api/needs: a saved bed's unmet need (its place and build day come with it) or a typed
 * one. A bed has at most one open need per material: asking twice is a 409, not a second alert.
 */
export async function openNeed(userId: string, input: OpenNeedInput, ctx: Context = {}): Promise<NeedView> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const today = dayOf(now);
  let location = input.location ?? null;
  let neededBy = input.needed_by ?? null;
  if (input.bed_id) {
    const bed = await findBed(input.bed_id, userId, q);
    if (!bed) throw new ApiError("invalid_input", "Some fields need another look.", { bed_id: "Choose one of your own beds." });
    if (!location && bed.lat !== null && bed.lng !== null) location = { lat: Number(bed.lat), lng: Number(bed.lng) };
    if (!neededBy && bed.start_date && bed.start_date >= today) neededBy = bed.start_date;
    const open = await q("needs").first("id").where({ owner_id: userId, bed_id: bed.id, material_code: input.material, status: "open" });
    if (open) throw new ApiError("conflict", "This bed already has an open need for that material: change that one instead.");
  }
  if (!location) throw new ApiError("invalid_input", "Some fields need another look.", { location: "This bed has no place yet: give the location {lat, lng}." });
  neededBy ??= addDays(today, DEFAULT_NEED_DAYS);
  const issue = neededByIssue(neededBy, now);
  if (issue) throw new ApiError("invalid_input", "Some fields need another look.", { needed_by: issue });

  const at = now.toISOString();
  const row: NeedRow = {
    id: newId(),
    owner_id: userId,
    bed_id: input.bed_id ?? null,
    material_code: input.material,
    quantity: input.quantity,
    unit: input.unit ?? NEED_UNITS[input.material][0],
    radius_km: input.radius_km,
    reach_km: reachBand(input.radius_km),
    lat: location.lat,
    lng: location.lng,
    needed_by: neededBy,
    alerts: input.alerts,
    status: "open",
    closed_at: null,
    created_at: at,
    updated_at: at,
  };
  try {
    await insertNeed(row, q);
  } catch (err) {
    if (isUniqueViolation(err)) throw new ApiError("conflict", "This bed already has an open need for that material: change that one instead.");
    throw err;
  }
  await noticeListingsQuietly(row, { db: q, clock });
  return (await needViews([row], q, now))[0];
}
