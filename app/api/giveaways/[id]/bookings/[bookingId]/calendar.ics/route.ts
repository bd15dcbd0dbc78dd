import { handle } from "@/lib/api/handler";
import { optionalRequestUser } from "@/lib/auth/current-user";
import { bookingCalendar } from "@/lib/services/giveaways/get-booking-calendar";

// GET /api/giveaways/:id/bookings/:bookingId/calendar.ics?t= — the booked slot for a calendar
// app: the token from the confirmation e-mail, or the booking household's own session.
export const GET = handle<{ id: string; bookingId: string }>(async ({ req, params }) => {
  const user = await optionalRequestUser(req);
  const ics = await bookingCalendar(params.id, params.bookingId, { token: req.nextUrl.searchParams.get("t"), userId: user?.id ?? null });
  return new Response(ics, {
    headers: { "content-type": "text/calendar; charset=utf-8", "content-disposition": `attachment; filename="giveaway-${params.bookingId.slice(0, 8)}.ics"` },
  });
});
