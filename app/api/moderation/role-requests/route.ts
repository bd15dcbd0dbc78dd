import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { listRoleRequests } from "@/lib/services/moderation/list-role-requests";

// GET /api/moderation/role-requests — roles people have asked for and that wait for a decision.
export const GET = withAuth(async () => NextResponse.json({ items: await listRoleRequests() }), ["moderator"]);
