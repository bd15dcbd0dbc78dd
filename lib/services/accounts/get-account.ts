import { findUserById } from "@/db/users";
import type { UserRow } from "@/db/types";
import { resolveContext, type Context } from "@/lib/context";

/** One account's row, for pages that show or prefill it. */
export async function getAccount(id: string, ctx: Context = {}): Promise<UserRow | undefined> {
  const { db: q } = resolveContext(ctx);
  return findUserById(id, q);
}
