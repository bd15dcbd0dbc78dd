import "server-only";
import Stripe from "stripe";
import { DEMO_SECRETS, readEnv, secret, type Env } from "@/lib/env";
import { cachedProbe } from "@/lib/health/cached-probe";

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

export function stripeConfig(envIn?: Env): StripeEndpoint {
  const env = readEnv(envIn);
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

// A request that calls Stripe waits at most this long for it (STRIPE_TIMEOUT_MS overrides),
// and does not retry: a page is answered in seconds even when Stripe is unreachable or takes
// the connection and never answers, and what could not be done is retried by the worker,
// with the same idempotency key, on its own schedule.
export const DEFAULT_STRIPE_TIMEOUT_MS = 5_000;

export function stripeTimeoutMs(env?: Env): number {
  return readEnv(env).STRIPE_TIMEOUT_MS ?? DEFAULT_STRIPE_TIMEOUT_MS;
}

/** The options the SDK is built with: the endpoint only when it is overridden. */
export function stripeOptions(endpoint: StripeEndpoint, env?: Env): Stripe.StripeConfig {
  const common = { maxNetworkRetries: 0, timeout: stripeTimeoutMs(env) };
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
  probeStripe.reset();
}

/** Whether Stripe answers (the balance, readable with any secret key), asked at most every few seconds. */
export const probeStripe = cachedProbe(() => stripe().balance.retrieve());

/**
 * Whether a failed Stripe call failed because Stripe could not be reached or was having
 * trouble (worth trying again as soon as it answers), rather than because it refused this
 * particular request.
 */
export function stripeUnreachable(err: unknown): boolean {
  return (
    err instanceof Stripe.errors.StripeConnectionError ||
    err instanceof Stripe.errors.StripeAPIError ||
    err instanceof Stripe.errors.StripeRateLimitError ||
    (err instanceof Stripe.errors.StripeError && (err.statusCode ?? 0) >= 500)
  );
}

export function webhookSecret(): string {
  return secret("STRIPE_WEBHOOK_SECRET");
}

// Stripe's default tolerance for the signature timestamp (docs.stripe.com/webhooks#replay-attacks).
export const WEBHOOK_TOLERANCE_SECONDS = 300;
