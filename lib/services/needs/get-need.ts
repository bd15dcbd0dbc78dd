import "server-only";
import { findOwnNeed } from "@/db/needs";
import { notFound } from "@/lib/api/errors";
import type { NeedView } from "@/lib/needs/view";
import { resolveContext, type Context } from "@/lib/context";
import { needViews } from "@/lib/services/needs/steps/need-views";

/** GET /api/needs/:id: one of my needs; anyone else's is a 404. */
export async function getNeed(userId: string, id: string, ctx: Context = {}): Promise<NeedView> {
  const { db: q, clock } = resolveContext(ctx);
  const row = await findOwnNeed(id, userId, q);
  if (!row) throw notFound("That need");
  return (await needViews([row], q, clock()))[0];
}
