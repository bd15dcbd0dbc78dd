import "server-only";
import { endEverySession } from "@/lib/auth/sessions";
import { resolveContext, type Context } from "@/lib/context";

/** Ends every session of the account, everywhere, this one included. */
export async function signOutEverywhere(userId: string, ctx: Context = {}): Promise<{ sessions_ended: number }> {
  const { db: q, clock } = resolveContext(ctx);
  return { sessions_ended: await endEverySession(userId, "signed_out_everywhere", clock, q) };
}
