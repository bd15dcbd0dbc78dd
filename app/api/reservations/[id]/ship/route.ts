import { orderActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { shipOrderSchema } from "@/lib/validation/grower";

// POST /api/reservations/:id/ship — { carrier, tracking }: the packed parcel is in the post; not while posting is paused.
export const POST = orderActionRoute("ship", shipOrderSchema, LISTING_ROLES);
