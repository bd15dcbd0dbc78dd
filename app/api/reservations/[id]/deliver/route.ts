import { orderActionRoute } from "@/lib/api/reservation-action";
import { orderStepSchema } from "@/lib/validation/grower";

// POST /api/reservations/:id/deliver — the parcel arrived (the buyer says so, or the grower from the tracking); closes the order.
export const POST = orderActionRoute("deliver", orderStepSchema);
