import { NextResponse, type NextRequest } from "next/server";
import Stripe from "stripe";
import { toErrorResponse } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { WEBHOOK_TOLERANCE_SECONDS, stripe, webhookSecret } from "@/lib/payments/stripe";
import { applyStripeEvent } from "@/lib/services/apply-stripe-event";

// POST /api/webhooks/stripe — Stripe's signed events. The signature is checked on the raw
// body (req.text(), never re-serialised JSON); a bad signature or a timestamp outside the
// tolerance is a 400. Each event id is applied once; a repeat answers 200 and does nothing.
export async function POST(req: NextRequest): Promise<Response> {
  const raw = await req.text();
  const signature = req.headers.get("stripe-signature");
  let event: Stripe.Event;
  try {
    if (!signature) throw new Error("missing Stripe-Signature header");
    event = stripe().webhooks.constructEvent(raw, signature, webhookSecret(), WEBHOOK_TOLERANCE_SECONDS);
  } catch (err) {
    return toErrorResponse(new ApiError("bad_request", `The webhook signature did not verify: ${(err as Error).message}`));
  }
  try {
    const outcome = await applyStripeEvent(event);
    return NextResponse.json({ received: true, outcome });
  } catch (err) {
    // A 500 makes Stripe deliver the event again later; nothing of it was kept.
    return toErrorResponse(err);
  }
}
