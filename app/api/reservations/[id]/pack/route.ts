import { orderActionRoute } from "@/lib/api/reservation-action";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { orderStepSchema } from "@/lib/validation/grower";

// POST /api/reservations/:id/pack — the grower has packed a paid, posted culture; the buyer is e-mailed.
export const POST = orderActionRoute("pack", orderStepSchema, LISTING_ROLES);
