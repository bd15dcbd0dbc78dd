import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { shippingSchema } from "@/lib/validation/grower";
import { growerShipping } from "@/lib/services/growers/get-grower-shipping";
import { saveGrowerShipping } from "@/lib/services/growers/save-grower-shipping";

// GET /api/grower/shipping — my shipping weekdays and whether posting is paused.
export const GET = withAuth(async ({ user }) => NextResponse.json({ shipping: await growerShipping(user.id) }), ["grower"]);

// PUT /api/grower/shipping — set the weekdays parcels go out; pause posting in heat or frost.
export const PUT = withAuth(async ({ req, user }) => {
  const input = parseInput(shippingSchema, await readJson(req));
  return NextResponse.json({ shipping: await saveGrowerShipping(user.id, input) });
}, ["grower"]);
