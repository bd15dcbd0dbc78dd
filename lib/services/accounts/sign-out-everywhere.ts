import "server-only";
import { endEverySession } from "@/lib/auth/sessions";
import type { Clock } from "@/lib/time/clock";

/** Ends every session of the account, everywhere, this one included. */
export async function signOutEverywhere(userId: string, clock: Clock = () => new Date()): Promise<{ sessions_ended: number }> {
  return { sessions_ended: await endEverySession(userId, "signed_out_everywhere", clock) };
}
