import { reservationActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { confirmSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/confirm — the supplier accepts a held request.
export const POST = reservationActionRoute("confirm", confirmSchema, LISTING_ROLES);
