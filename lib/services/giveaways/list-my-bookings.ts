import { bookingsOf, type MyBookingRow } from "@/db/giveaways";

/** The visitor's giveaway bookings from a date on, without the cancelled ones. */
export async function listMyBookings(userId: string, fromDate: string): Promise<MyBookingRow[]> {
  return (await bookingsOf(userId, { fromDate })).filter((b) => b.status !== "cancelled");
}
