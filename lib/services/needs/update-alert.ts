import "server-only";
import { dismissAlert, markAlertsSeen } from "@/db/need-alerts";
import { notFound } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";

/** PATCH /api/needs/alerts/:id: mark seen, or dismiss. Anyone else's notice is a 404. */
export async function updateAlert(userId: string, id: string, change: { seen?: boolean; dismissed?: boolean }, ctx: Context = {}): Promise<void> {
  const { db: q, clock } = resolveContext(ctx);
  const at = clock().toISOString();
  const mine = await q("need_alerts").first("id").where({ id, user_id: userId });
  if (!mine) throw notFound("That alert");
  if (change.dismissed) await dismissAlert(userId, id, at, q);
  else if (change.seen) await markAlertsSeen(userId, [id], at, q);
}
