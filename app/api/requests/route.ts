import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { listReservations } from "@/lib/services/reservations/list-reservations";

// GET /api/requests — reservations on the listings I (or my organisation) give, newest first.
export const GET = withAuth(async ({ user }) => {
  return NextResponse.json({ requests: await listReservations(user.id, "supplier") });
}, LISTING_ROLES);
