import { reservationActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { collectSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/collect — the supplier enters the pickup code or marks it collected.
export const POST = reservationActionRoute("collect", collectSchema, LISTING_ROLES);
