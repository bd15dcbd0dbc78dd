import { NextResponse, type NextRequest } from "next/server";
import Stripe from "stripe";
import { toErrorResponse } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { WEBHOOK_TOLERANCE_SECONDS, stripe, webhookSecret } from "@/lib/payments/stripe";
import { receiveStripeEvent } from "@/lib/services/payments/receive-stripe-event";

// POST /api/webhooks/stripe — Stripe's signed events. The signature is checked on the raw
// body (req.text(), never re-serialised JSON); a bad signature, or a timestamp more than the
// tolerance in the past or in the future, is a 400. A verified event is only a pointer: the
// object it names is read back from Stripe and Stripe's record is applied
// (lib/services/payments/receive-stripe-event.ts). Each event id is handled once; a repeat answers 200.

/** The SDK refuses old timestamps; a timestamp from the future is refused here too. */
function signedAt(header: string): number | null {
  const t = /(?:^|,)\s*t=(\d+)/.exec(header)?.[1];
  return t ? Number(t) : null;
}

export async function POST(req: NextRequest): Promise<Response> {
  const raw = await req.text();
  const signature = req.headers.get("stripe-signature");
  let event: Stripe.Event;
  try {
    if (!signature) throw new Error("missing Stripe-Signature header");
    event = stripe().webhooks.constructEvent(raw, signature, webhookSecret(), WEBHOOK_TOLERANCE_SECONDS);
    const t = signedAt(signature);
    if (t === null || t - Date.now() / 1000 > WEBHOOK_TOLERANCE_SECONDS) throw new Error("Timestamp is in the future, outside the tolerance zone");
  } catch (err) {
    return toErrorResponse(new ApiError("bad_request", `The webhook signature did not verify: ${(err as Error).message}`));
  }
  try {
    const outcome = await receiveStripeEvent(event);
    return NextResponse.json({ received: true, outcome });
  } catch (err) {
    // A 500 makes Stripe deliver the event again later; nothing of it was kept.
    return toErrorResponse(err);
  }
}
