import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { notFound } from "@/lib/api/errors";
import { rolesOf } from "@/db/users";
import { growerShipping } from "@/lib/services/grower-shipping";

// GET /api/growers/:id/shipping — public: the days a grower posts and whether posting is paused, for buyers.
export const GET = handle<{ id: string }>(async ({ params }) => {
  const roles = await rolesOf(params.id);
  if (!roles.some((r) => r.role === "grower" && r.status === "active")) throw notFound("That grower");
  return NextResponse.json({ shipping: await growerShipping(params.id) });
});
