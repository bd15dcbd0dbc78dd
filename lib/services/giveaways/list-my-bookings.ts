import { bookingsOf, type MyBookingRow } from "@/db/giveaways";
import { resolveContext, type Context } from "@/lib/context";

/** The visitor's giveaway bookings from a date on, without the cancelled ones. */
export async function listMyBookings(userId: string, fromDate: string, ctx: Context = {}): Promise<MyBookingRow[]> {
  const { db: q } = resolveContext(ctx);
  return (await bookingsOf(userId, { fromDate }, q)).filter((b) => b.status !== "cancelled");
}
