import { reservationActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { noShowSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/no-show — after the pickup time, the supplier records that nobody came.
export const POST = reservationActionRoute("no_show", noShowSchema, LISTING_ROLES);
