import "server-only";
import Stripe from "stripe";
import { DEMO_SECRETS, secret } from "@/lib/env";

// The official Stripe SDK. With the local test key (the default) it talks to the
// Stripe-compatible fake in lib/fakes/stripe; with a real test key and no STRIPE_API_HOST
// it talks to Stripe itself. Only the endpoint differs, never the calls.
//
// The endpoint comes from the environment: STRIPE_API_HOST, STRIPE_API_PORT (else the
// fake's STRIPE_FAKE_PORT) and STRIPE_API_PROTOCOL (http unless told otherwise, as the fake
// and stripe-mock speak plain HTTP). Without a host override none of them applies.

export const LOCAL_STRIPE_KEY = "sk_test_duffbank_local";
export const LOCAL_WEBHOOK_SECRET = DEMO_SECRETS.STRIPE_WEBHOOK_SECRET;
const LOCAL_HOST = "127.0.0.1";
const LOCAL_PORT = 12111;

const g = globalThis as unknown as { __duffbankStripe?: Stripe };

export interface StripeEndpoint {
  key: string;
  /** null: Stripe's own API (api.stripe.com over HTTPS), the SDK's default. */
  host: string | null;
  port: number | null;
  protocol: "http" | "https" | null;
}

export function stripeConfig(env: Record<string, string | undefined> = process.env): StripeEndpoint {
  const key = env.STRIPE_SECRET_KEY || LOCAL_STRIPE_KEY;
  const host = env.STRIPE_API_HOST || (key === LOCAL_STRIPE_KEY ? LOCAL_HOST : null);
  if (!host) return { key, host: null, port: null, protocol: null };
  const protocol = env.STRIPE_API_PROTOCOL || "http";
  if (protocol !== "http" && protocol !== "https") throw new Error(`STRIPE_API_PROTOCOL must be http or https, not "${protocol}".`);
  const portText = env.STRIPE_API_PORT || env.STRIPE_FAKE_PORT || (protocol === "https" ? "443" : String(LOCAL_PORT));
  const port = Number(portText);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`STRIPE_API_PORT must be a port number, not "${portText}".`);
  return { key, host, port, protocol };
}

/** The options the SDK is built with: the endpoint only when it is overridden. */
export function stripeOptions(endpoint: StripeEndpoint): Stripe.StripeConfig {
  // Two retries: the SDK resends with the same idempotency key, so a retry never doubles a charge.
  const common = { maxNetworkRetries: 2, timeout: 15_000 };
  if (!endpoint.host) return common;
  return { ...common, host: endpoint.host, port: endpoint.port!, protocol: endpoint.protocol! };
}

export function stripe(): Stripe {
  if (!g.__duffbankStripe) {
    const endpoint = stripeConfig();
    g.__duffbankStripe = new Stripe(endpoint.key, stripeOptions(endpoint));
  }
  return g.__duffbankStripe;
}

/** Tests start the fake on a free port and point the SDK at it. */
export function resetStripe() {
  g.__duffbankStripe = undefined;
}

export function webhookSecret(): string {
  return secret("STRIPE_WEBHOOK_SECRET");
}

// Stripe's default tolerance for the signature timestamp (docs.stripe.com/webhooks#replay-attacks).
export const WEBHOOK_TOLERANCE_SECONDS = 300;
