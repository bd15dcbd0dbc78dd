import { FakeStripeError } from "./errors";

// Amounts are integers in the currency's smallest unit, as on Stripe. The number of
// decimals comes from Intl's ISO 4217 data, which agrees with Stripe's zero-decimal list
// for the currencies Duffbank can plausibly use (JPY, KRW: 0; GBP, EUR, USD: 2).
function fractionDigits(currency: string): number {
  return (
    new Intl.NumberFormat("en", { style: "currency", currency: currency.toUpperCase() })
      .resolvedOptions().maximumFractionDigits ?? 2
  );
}

export function formatAmount(amount: number, currency: string): string {
  const digits = fractionDigits(currency);
  return new Intl.NumberFormat("en-GB", {
    style: "currency",
    currency: currency.toUpperCase(),
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(amount / 10 ** digits);
}

// Stripe's minimum charge per settlement currency, from memory of
// docs.stripe.com/currencies ("Minimum and maximum charge amounts"). Real Stripe refuses
// a smaller PaymentIntent or Checkout Session; enforcing it here means a too-small deposit
// fails in development rather than on launch day. Unlisted currencies are not checked.
const MINIMUM_CHARGE: Record<string, number> = {
  usd: 50,
  eur: 50,
  gbp: 30,
  cad: 50,
  aud: 50,
  nzd: 50,
  chf: 50,
  jpy: 50,
  sek: 300,
  nok: 300,
  dkk: 250,
};

export function assertChargeable(amount: number, currency: string, param = "amount"): void {
  const min = MINIMUM_CHARGE[currency];
  if (min !== undefined && amount < min) {
    throw new FakeStripeError(400, {
      type: "invalid_request_error",
      code: "amount_too_small",
      param,
      message: `Amount must be at least ${formatAmount(min, currency)} ${currency}`,
    });
  }
}
