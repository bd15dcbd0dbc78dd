// Where the Stripe SDK is pointed: host, port and protocol come from the environment; the
// local key goes to the fake; a real test key with no host override goes to Stripe itself.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "@/lib/fakes/stripe/server";
import { LOCAL_STRIPE_KEY, resetStripe, stripe, stripeConfig, stripeOptions } from "@/lib/payments/stripe";

const REAL_LOOKING_KEY = "sk_test_51AbCdEfGhIjKlMnOp";

describe("stripeConfig", () => {
  const cases: [string, Record<string, string>, ReturnType<typeof stripeConfig>][] = [
    ["nothing set: the local fake on its default port", {}, { key: LOCAL_STRIPE_KEY, host: "127.0.0.1", port: 12111, protocol: "http" }],
    ["the fake moved", { STRIPE_FAKE_PORT: "23111" }, { key: LOCAL_STRIPE_KEY, host: "127.0.0.1", port: 23111, protocol: "http" }],
    ["STRIPE_API_PORT wins over STRIPE_FAKE_PORT", { STRIPE_API_PORT: "4010", STRIPE_FAKE_PORT: "23111" }, { key: LOCAL_STRIPE_KEY, host: "127.0.0.1", port: 4010, protocol: "http" }],
    ["a real test key and no override: Stripe itself", { STRIPE_SECRET_KEY: REAL_LOOKING_KEY, STRIPE_FAKE_PORT: "23111" }, { key: REAL_LOOKING_KEY, host: null, port: null, protocol: null }],
    ["port and protocol alone are no override", { STRIPE_SECRET_KEY: REAL_LOOKING_KEY, STRIPE_API_PORT: "4010", STRIPE_API_PROTOCOL: "http" }, { key: REAL_LOOKING_KEY, host: null, port: null, protocol: null }],
    ["a host override defaults to http", { STRIPE_SECRET_KEY: REAL_LOOKING_KEY, STRIPE_API_HOST: "stripe-mock.internal", STRIPE_API_PORT: "12111" }, { key: REAL_LOOKING_KEY, host: "stripe-mock.internal", port: 12111, protocol: "http" }],
    ["https on its default port", { STRIPE_API_HOST: "stripe-proxy.example.org", STRIPE_API_PROTOCOL: "https" }, { key: LOCAL_STRIPE_KEY, host: "stripe-proxy.example.org", port: 443, protocol: "https" }],
    ["everything given", { STRIPE_API_HOST: "10.0.0.5", STRIPE_API_PORT: "8443", STRIPE_API_PROTOCOL: "https" }, { key: LOCAL_STRIPE_KEY, host: "10.0.0.5", port: 8443, protocol: "https" }],
  ];
  for (const [name, env, expected] of cases) {
    it(name, () => expect(stripeConfig(env)).toEqual(expected));
  }

  it("refuses a protocol or port that cannot work", () => {
    expect(() => stripeConfig({ STRIPE_API_PROTOCOL: "ftp" })).toThrow(/STRIPE_API_PROTOCOL/);
    expect(() => stripeConfig({ STRIPE_API_PORT: "eighty" })).toThrow(/STRIPE_API_PORT/);
    expect(() => stripeConfig({ STRIPE_API_PORT: "70000" })).toThrow(/STRIPE_API_PORT/);
  });

  it("leaves the SDK on its own endpoint when there is no override", () => {
    const options = stripeOptions(stripeConfig({ STRIPE_SECRET_KEY: REAL_LOOKING_KEY }));
    expect(options).not.toHaveProperty("host");
    expect(options).not.toHaveProperty("port");
    expect(options).not.toHaveProperty("protocol");
    expect(stripeOptions(stripeConfig({}))).toMatchObject({ host: "127.0.0.1", port: 12111, protocol: "http" });
  });

  it("gives a request a few seconds of Stripe and no retries (STRIPE_TIMEOUT_MS overrides, a bad value is ignored)", () => {
    expect(stripeOptions(stripeConfig({}), {})).toMatchObject({ timeout: 5000, maxNetworkRetries: 0 });
    expect(stripeOptions(stripeConfig({}), { STRIPE_TIMEOUT_MS: "2500" })).toMatchObject({ timeout: 2500 });
    expect(stripeOptions(stripeConfig({}), { STRIPE_TIMEOUT_MS: "soon" })).toMatchObject({ timeout: 5000 });
  });
});

describe("the SDK built from the environment", () => {
  let fake: StripeFake;
  const saved = { ...process.env };
  beforeAll(async () => {
    fake = await startStripeFake({ port: 0, webhookUrl: null });
  });
  afterAll(async () => {
    for (const k of ["STRIPE_SECRET_KEY", "STRIPE_API_HOST", "STRIPE_API_PORT", "STRIPE_API_PROTOCOL", "STRIPE_FAKE_PORT"]) {
      if (saved[k] === undefined) delete process.env[k];
      else process.env[k] = saved[k];
    }
    resetStripe();
    await fake.close();
  });
  const use = (env: Record<string, string | undefined>) => {
    for (const [k, v] of Object.entries(env)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
    resetStripe();
  };

  it("reaches the fake through STRIPE_API_HOST and STRIPE_API_PORT", async () => {
    use({ STRIPE_SECRET_KEY: undefined, STRIPE_API_HOST: "127.0.0.1", STRIPE_API_PORT: String(fake.port), STRIPE_API_PROTOCOL: undefined, STRIPE_FAKE_PORT: "1" });
    const intent = await stripe().paymentIntents.create({ amount: 700, currency: "gbp" });
    expect(fake.state.paymentIntents.has(intent.id)).toBe(true);
  });

  it("speaks the protocol it is told: https to the plain-HTTP fake cannot connect", async () => {
    use({ STRIPE_API_HOST: "127.0.0.1", STRIPE_API_PORT: String(fake.port), STRIPE_FAKE_PORT: String(fake.port), STRIPE_API_PROTOCOL: "https" });
    const before = fake.state.paymentIntents.size;
    await expect(stripe().paymentIntents.create({ amount: 700, currency: "gbp" })).rejects.toBeInstanceOf(Stripe.errors.StripeConnectionError);
    expect(fake.state.paymentIntents.size).toBe(before);
  });
});
