import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { resumeCheckout } from "@/lib/services/reservations/resume-checkout";

// POST /api/reservations/:id/checkout — the checkout page for a reservation still to be paid
// (again after a declined card, or when Stripe could not be reached at first).
export const POST = withAuth<{ id: string }>(
  idempotent(async ({ params, user }) => NextResponse.json({ checkout_url: await resumeCheckout(params.id, user.id) })),
  ["gardener"],
);
