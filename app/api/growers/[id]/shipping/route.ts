import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { notFound } from "@/lib/api/errors";
import { getPublicShipping } from "@/lib/services/growers/get-public-shipping";

// GET /api/growers/:id/shipping — public: the days a grower posts and whether posting is paused, for buyers.
export const GET = handle<{ id: string }>(async ({ params }) => {
  const shipping = await getPublicShipping(params.id);
  if (!shipping) throw notFound("That grower");
  return NextResponse.json({ shipping });
});
