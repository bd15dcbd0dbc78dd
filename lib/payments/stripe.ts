import "server-only";
import Stripe from "stripe";

// The official Stripe SDK. With the local test key (the default) it talks to the
// Stripe-compatible fake in lib/fakes/stripe; with a real test key and no STRIPE_API_HOST
// it talks to Stripe itself. Only the endpoint differs, never the calls.

export const LOCAL_STRIPE_KEY = "sk_test_duffbank_local";
export const LOCAL_WEBHOOK_SECRET = "whsec_duffbank_local";

const g = globalThis as unknown as { __duffbankStripe?: Stripe };

export function stripeConfig(env: NodeJS.ProcessEnv = process.env): { key: string; host: string | null; port: number } {
  const key = env.STRIPE_SECRET_KEY || LOCAL_STRIPE_KEY;
  const host = env.STRIPE_API_HOST || (key === LOCAL_STRIPE_KEY ? "127.0.0.1" : null);
  return { key, host, port: Number(env.STRIPE_FAKE_PORT || 12111) };
}

export function stripe(): Stripe {
  if (!g.__duffbankStripe) {
    const { key, host, port } = stripeConfig();
    // Two retries: the SDK resends with the same idempotency key, so a retry never doubles a charge.
    const common = { maxNetworkRetries: 2, timeout: 15_000 };
    g.__duffbankStripe = host ? new Stripe(key, { ...common, host, port, protocol: "http" }) : new Stripe(key, common);
  }
  return g.__duffbankStripe;
}

/** Tests start the fake on a free port and point the SDK at it. */
export function resetStripe() {
  g.__duffbankStripe = undefined;
}

export function webhookSecret(): string {
  return process.env.STRIPE_WEBHOOK_SECRET || LOCAL_WEBHOOK_SECRET;
}

// Stripe's default tolerance for the signature timestamp (docs.stripe.com/webhooks#replay-attacks).
export const WEBHOOK_TOLERANCE_SECONDS = 300;
