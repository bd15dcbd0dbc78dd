import { reservationActionRoute } from "@/lib/api/reservation-action";
import { cancelSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/cancel — either side calls it off (the deposit rule applies).
export const POST = reservationActionRoute("cancel", cancelSchema);
