import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { growerOrders } from "@/lib/services/growers/list-grower-orders";

// GET /api/grower/orders — my open live-culture orders (to answer, pack, post, or on their way), with my posting days.
export const GET = withAuth(async ({ user }) => NextResponse.json(await growerOrders(user.id)), ["grower"]);
