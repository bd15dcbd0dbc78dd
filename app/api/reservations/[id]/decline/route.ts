import { reservationActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { declineSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/decline — the supplier turns a held request down; money goes back.
export const POST = reservationActionRoute("decline", declineSchema, LISTING_ROLES);
