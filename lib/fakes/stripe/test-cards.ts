import type { CardDetails } from "./types";

// Stripe's published test cards (docs.stripe.com/testing): what each number does when
// charged. Only these three are modelled; the page tells anyone who types another
// number to use one of them, because a real card number has no business here.
interface TestCard {
  brand: string;
  funding: "credit" | "debit";
  decline: null | { decline_code: string; message: string };
}

// Decline messages are the ones Stripe's API puts in error.message for these cards,
// so code that logs or maps them sees the same text.
const TEST_CARDS: Record<string, TestCard> = {
  "4242424242424242": { brand: "visa", funding: "credit", decline: null },
  "4000000000000002": {
    brand: "visa",
    funding: "credit",
    decline: { decline_code: "generic_decline", message: "Your card was declined." },
  },
  "4000000000009995": {
    brand: "visa",
    funding: "credit",
    decline: { decline_code: "insufficient_funds", message: "Your card has insufficient funds." },
  },
};

// Test PaymentMethod ids Stripe accepts in place of a card (docs.stripe.com/testing,
// from memory), mapped to the card number they stand for, so server-side confirmation
// with `payment_method` behaves like paying on the hosted page.
export const TEST_PAYMENT_METHODS: Record<string, string> = {
  pm_card_visa: "4242424242424242",
  pm_card_visa_chargeDeclined: "4000000000000002",
  pm_card_chargeDeclined: "4000000000000002",
  pm_card_visa_chargeDeclinedInsufficientFunds: "4000000000009995",
  pm_card_chargeDeclinedInsufficientFunds: "4000000000009995",
};

export interface CardAttempt {
  card: CardDetails;
  name: string | null;
  /** null when the card is approved. */
  decline: TestCard["decline"];
}

export function attemptFor(number: string, expMonth: number, expYear: number, name: string | null): CardAttempt | null {
  const test = TEST_CARDS[number];
  if (!test) return null;
  return {
    card: { brand: test.brand, last4: number.slice(-4), exp_month: expMonth, exp_year: expYear, funding: test.funding },
    name,
    decline: test.decline,
  };
}

export interface CardForm {
  card_number?: string;
  expiry?: string;
  cvc?: string;
  name?: string;
}

export type CardField = keyof CardForm;

export type CardFormResult =
  | { ok: true; attempt: CardAttempt }
  | { ok: false; errors: Partial<Record<CardField, string>> };

/** Checks the hosted page's fields in Duffbank's words; `nowSeconds` decides what "expired" means. */
export function readCardForm(form: CardForm, nowSeconds: number): CardFormResult {
  const errors: Partial<Record<CardField, string>> = {};
  const number = (form.card_number ?? "").replace(/[\s-]/g, "");
  if (number === "") errors.card_number = "Enter a card number.";
  else if (!/^\d+$/.test(number)) errors.card_number = "A card number is digits only (spaces are fine).";
  else if (!TEST_CARDS[number]) {
    errors.card_number =
      "Use one of Stripe's test card numbers, for example 4242 4242 4242 4242. This page never takes a real card.";
  }

  const expiry = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(form.expiry ?? "");
  let expMonth = 0;
  let expYear = 0;
  if (!expiry) errors.expiry = "Enter the expiry as MM/YY, for example 12/34.";
  else {
    expMonth = Number(expiry[1]);
    expYear = expiry[2].length === 2 ? 2000 + Number(expiry[2]) : Number(expiry[2]);
    // A card is valid through the last day of its expiry month.
    const firstOfNextMonth = Date.UTC(expYear, expMonth, 1) / 1000;
    if (expMonth < 1 || expMonth > 12) errors.expiry = "The month must be between 01 and 12.";
    else if (firstOfNextMonth <= nowSeconds) errors.expiry = "That expiry date has passed. Use any date in the future.";
  }

  const cvc = (form.cvc ?? "").trim();
  if (!/^\d{3,4}$/.test(cvc)) errors.cvc = "The CVC is 3 or 4 digits.";

  const name = (form.name ?? "").trim();
  if (name === "") errors.name = "Enter the name on the card.";

  if (Object.keys(errors).length > 0) return { ok: false, errors };
  return { ok: true, attempt: attemptFor(number, expMonth, expYear, name)! };
}
