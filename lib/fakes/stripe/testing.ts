// Helpers for tests that need to get through the fake's hosted checkout page without a
// browser: they submit the same form a person would.

// Stripe's published test card numbers (docs.stripe.com/testing), spaced the way people type them.
export const TEST_CARDS = {
  approved: "4242 4242 4242 4242",
  declined: "4000 0000 0000 0002",
  insufficientFunds: "4000 0000 0000 9995",
} as const;

export interface HostedCardInput {
  card_number: string;
  expiry: string;
  cvc: string;
  name: string;
}

export interface HostedPaymentResult {
  status: number;
  /** The redirect target after an approved payment, else null. */
  location: string | null;
  html: string;
}

/** A card that is always in date: the expiry is in December of next year. */
export function validCard(number: string = TEST_CARDS.approved): HostedCardInput {
  const year = (new Date().getUTCFullYear() + 1) % 100;
  return { card_number: number, expiry: `12/${String(year).padStart(2, "0")}`, cvc: "123", name: "Test Gardener" };
}

/** Posts the hosted page's form for a Checkout Session URL (session.url). */
export async function submitHostedPayment(
  sessionUrl: string,
  card: Partial<HostedCardInput> = {},
): Promise<HostedPaymentResult> {
  const body = new URLSearchParams({ ...validCard(), ...card });
  const res = await fetch(sessionUrl, {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    body,
    redirect: "manual",
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}
