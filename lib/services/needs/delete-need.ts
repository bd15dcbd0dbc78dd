import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { deleteOwnNeed } from "@/db/needs";
import { notFound } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";

/** DELETE /api/needs/:id: the need and its alerts go; reservations made for it stay. Anyone else's is a 404. */
export async function deleteNeed(userId: string, id: string, ctx: Context = {}): Promise<void> {
  const { db: q } = resolveContext(ctx);
  const gone = await writeTransaction(q, (trx) => deleteOwnNeed(id, userId, trx));
  if (!gone) throw notFound("That need");
}
