import { formatAmount } from "./amounts";
import type { CardField, CardForm } from "./test-cards";
import type { CheckoutSession, LineItem } from "./types";
import palette from "../../../tailwind.config";

// The hosted page the fake's Checkout Sessions point at: Duffbank's local test checkout. It
// says plainly that it is a stand-in, offers the public test card numbers as outcomes to
// click, and is self-contained (no scripts, fonts or images from anywhere).

function esc(value: string): string {
  return value
    .replaceAll("&", "&amp;")
    .replaceAll("<", "&lt;")
    .replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;")
    .replaceAll("'", "&#39;");
}

// Duffbank's palette, read from the one place it is written.
const { humus, moss, litter, ember } = palette.theme!.extend!.colors as Record<"humus" | "moss" | "litter" | "ember", Record<number, string>>;

const STYLE = `
  :root { color-scheme: light; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; color: ${humus[900]}; background: ${humus[50]}; }
  .stand { background: repeating-linear-gradient(135deg, ${litter[100]} 0 18px, #fff7e6 18px 36px); border-bottom: 3px solid ${litter[500]}; }
  .stand > div { max-width: 56rem; margin: 0 auto; padding: 1.25rem 1rem; display: flex; gap: 1rem; align-items: flex-start; }
  .kicker { margin: 0; font-size: .8rem; font-weight: 700; letter-spacing: .08em; text-transform: uppercase; color: ${litter[700]}; }
  .stand h1 { margin: .1rem 0 .3rem; font-size: 1.5rem; }
  .stand p { margin: 0; max-width: 42rem; }
  main { max-width: 56rem; margin: 1.5rem auto 3rem; padding: 0 1rem; display: grid; gap: 1.25rem; }
  @media (min-width: 48rem) { main { grid-template-columns: minmax(0, 1fr) minmax(0, 1.3fr); } .wide { grid-column: 1 / -1; } }
  h2 { font-size: 1.15rem; margin: 0 0 .5rem; }
  .box { background: #fff; border: 1px solid ${humus[200]}; border-radius: 1.25rem .375rem 1.25rem .375rem; padding: 1.1rem 1.25rem; }
  .muted { color: ${humus[700]}; font-size: .95rem; }
  ul.items { list-style: none; margin: 0; padding: 0; }
  ul.items li { display: flex; justify-content: space-between; gap: 1rem; padding: .35rem 0; border-bottom: 1px dashed ${humus[200]}; }
  ul.items li.total { border: 0; font-weight: 700; }
  .outcomes { display: grid; gap: .6rem; margin: .75rem 0 0; padding: 0; list-style: none; }
  .outcome { width: 100%; display: grid; grid-template-columns: auto 1fr; gap: .1rem .75rem; align-items: center; text-align: left; font: inherit; padding: .75rem .9rem; border-radius: .75rem; border: 2px solid ${humus[300]}; background: #fff; color: ${humus[900]}; cursor: pointer; }
  .outcome:hover { background: ${humus[100]}; }
  .outcome .dot { grid-row: span 2; width: 1rem; height: 1rem; border-radius: 50%; }
  .outcome strong { font-size: 1.02rem; }
  .outcome code { font-size: .95rem; color: ${humus[700]}; }
  .ok { border-color: ${moss[600]}; } .ok .dot { background: ${moss[600]}; }
  .no .dot { background: ${ember[600]}; }
  .poor .dot { background: ${litter[500]}; }
  button:focus-visible, a:focus-visible, input:focus-visible, summary:focus-visible { outline: 3px solid ${litter[500]}; outline-offset: 2px; }
  .box { align-self: start; }
  details summary { cursor: pointer; font-weight: 600; min-height: 2.75rem; display: flex; align-items: center; list-style: none; }
  details summary::-webkit-details-marker { display: none; }
  details summary::after { content: ""; width: .5rem; height: .5rem; margin-left: .6rem; border-right: 2px solid currentColor; border-bottom: 2px solid currentColor; transform: translateY(-.2rem) rotate(45deg); }
  details[open] summary::after { transform: translateY(.1rem) rotate(-135deg); }
  label { display: block; font-weight: 600; margin-top: .9rem; }
  input { width: 100%; font: inherit; padding: .55rem .6rem; border: 1px solid ${humus[400]}; border-radius: .5rem; background: #fff; color: ${humus[900]}; }
  input[aria-invalid="true"] { border-color: ${ember[600]}; }
  .row { display: flex; gap: .75rem; } .row > div { flex: 1; }
  .field-error { color: ${ember[600]}; margin: .25rem 0 0; font-size: .9rem; }
  .alert { border: 1px solid ${ember[600]}; background: ${ember[100]}; color: ${ember[800]}; border-radius: .5rem; padding: .7rem .8rem; margin: 0 0 .75rem; }
  .pay { margin-top: 1.1rem; font: inherit; font-weight: 700; padding: .7rem 1.1rem; border: 0; border-radius: .5rem; background: ${moss[600]}; color: #fff; cursor: pointer; }
  .pay:hover { background: ${moss[700]}; }
  a { color: ${moss[700]}; }
  .back { display: inline-block; margin-top: 1rem; font-weight: 600; }
`;

// Duffbank's mark, drawn inline so the page loads nothing from anywhere.
const MARK = `<svg viewBox="0 0 48 48" width="44" height="44" aria-hidden="true"><rect x="2" y="2" width="44" height="44" rx="12" fill="${moss[600]}"/><path d="M8 36c6-3 26-3 32 0v4H8z" fill="${humus[800]}"/><path d="M8 30c7-3.5 25-3.5 32 0v5c-7-3-25-3-32 0z" fill="${humus[500]}"/><path d="M8 24.5c8-3.5 24-3.5 32 0V29c-7-3-25-3-32 0z" fill="${litter[500]}"/></svg>`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${esc(title)} · Duffbank's local test checkout</title>
<style>${STYLE}</style>
</head>
<body>
<header class="stand"><div>${MARK}<div>
<p class="kicker">Test stand-in · no real money</p>
<h1>Duffbank's local test checkout</h1>
<p>This page stands in for card payment while Duffbank runs on this computer. The app talks to it exactly as it would to the real payment service, so every step after it behaves the same. Nothing chosen or typed here leaves this machine.</p>
</div></div></header>
<main>
${body}
</main>
</body>
</html>`;
}

export interface PayPageInput {
  session: CheckoutSession;
  items: LineItem[];
  captureLater: boolean;
  values?: CardForm;
  errors?: Partial<Record<CardField, string>>;
  /** A decline or other problem with the whole attempt, shown in an alert. */
  problem?: string;
}

const FIELDS: Array<{ name: CardField; label: string; autocomplete: string; inputmode?: string; placeholder?: string }> = [
  { name: "card_number", label: "Card number", autocomplete: "off", inputmode: "numeric", placeholder: "4242 4242 4242 4242" },
  { name: "expiry", label: "Expiry (MM/YY)", autocomplete: "off", inputmode: "numeric", placeholder: "12/34" },
  { name: "cvc", label: "CVC", autocomplete: "off", inputmode: "numeric", placeholder: "123" },
  { name: "name", label: "Name on card", autocomplete: "off" },
];

// The outcomes to click: each is one of the published test card numbers, sent with a far
// expiry, a CVC and a name, exactly as if typed into the form below.
const OUTCOMES: Array<{ number: string; tone: "ok" | "no" | "poor"; title: string; says: string }> = [
  { number: "4242424242424242", tone: "ok", title: "Pay: the card is approved", says: "paid at once, or held when the payment is a deposit" },
  { number: "4000000000000002", tone: "no", title: "Decline the card", says: "a plain decline; nothing is taken and you can try again" },
  { number: "4000000000009995", tone: "poor", title: "Decline: not enough funds", says: "declined for insufficient funds; nothing is taken" },
];
const spaced = (n: string) => n.replace(/(\d{4})(?=\d)/g, "$1 ");

function field(f: (typeof FIELDS)[number], input: PayPageInput): string {
  const error = input.errors?.[f.name];
  const value = input.values?.[f.name] ?? "";
  const id = `field-${f.name}`;
  const describedBy = error ? ` aria-describedby="${id}-error" aria-invalid="true"` : "";
  return `<div>
  <label for="${id}">${esc(f.label)}</label>
  <input id="${id}" name="${f.name}" autocomplete="${f.autocomplete}"${f.inputmode ? ` inputmode="${f.inputmode}"` : ""}${
    f.placeholder ? ` placeholder="${esc(f.placeholder)}"` : ""
  } value="${esc(value)}" required${describedBy}>
  ${error ? `<p class="field-error" id="${id}-error">${esc(error)}</p>` : ""}
</div>`;
}

export function renderPayPage(input: PayPageInput): string {
  const { session, items } = input;
  const total = formatAmount(session.amount_total, session.currency);
  const rows = items
    .map((item) => `<li><span>${esc(item.description)}${item.quantity > 1 ? ` × ${item.quantity}` : ""}</span><span>${esc(formatAmount(item.amount_total, item.currency))}</span></li>`)
    .join("\n");
  const fieldErrors = input.errors && Object.keys(input.errors).length > 0;
  const alert = input.problem
    ? `<div class="alert" role="alert">${esc(input.problem)}</div>`
    : fieldErrors
      ? `<div class="alert" role="alert">Some details need another look — see the notes under the fields.</div>`
      : "";
  const action = `/pay/${esc(session.id)}`;
  const outcomes = OUTCOMES.map(
    (o) => `<li><form method="post" action="${action}" novalidate>
  <input type="hidden" name="expiry" value="12/99"><input type="hidden" name="cvc" value="123"><input type="hidden" name="name" value="Duffbank test buyer">
  <button class="outcome ${o.tone}" type="submit" name="card_number" value="${o.number}"><span class="dot" aria-hidden="true"></span><strong>${esc(o.title)}</strong><span><code>${spaced(o.number)}</code> · ${esc(o.says)}</span></button>
</form></li>`,
  ).join("\n");
  const [number, expiry, cvc, name] = FIELDS;
  return layout(
    `Pay ${total}`,
    `<section class="box" aria-labelledby="what-heading">
  <h2 id="what-heading">Pay ${esc(total)}</h2>
  <p class="muted">${
    input.captureLater
      ? "A deposit: the amount is held on the test card now and only taken later, if at all."
      : "Taken from the test card as soon as the outcome is chosen."
  }</p>
  <ul class="items">
${rows}
<li class="total"><span>Altogether</span><span>${esc(total)}</span></li>
  </ul>
  ${session.cancel_url ? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>` : ""}
</section>
<section class="box" aria-labelledby="outcome-heading">
  <h2 id="outcome-heading">Choose what happens</h2>
  ${alert}
  <p class="muted">Each button sends one of the public test card numbers, the way a buyer's card would answer.</p>
  <ul class="outcomes">
${outcomes}
  </ul>
  <details${fieldErrors ? " open" : ""}>
    <summary>Or type a test card by hand</summary>
    <form method="post" action="${action}" novalidate>
      ${field(number, input)}
      <div class="row">${field(expiry, input)}${field(cvc, input)}</div>
      ${field(name, input)}
      <button class="pay" type="submit">Pay ${esc(total)}</button>
      <p class="muted">Only the three numbers above are known here. Any future expiry and any 3-digit CVC will do.</p>
    </form>
  </details>
</section>`,
  );
}

/** For a session that can no longer be paid: already complete or expired. */
export function renderClosedPage(session: CheckoutSession, successUrl: string | null): string {
  if (session.status === "complete") {
    return layout(
      "Already paid",
      `<section class="box wide"><h2>This payment is already done</h2>
<p>Nothing more to pay here.</p>
${successUrl ? `<a class="back" href="${esc(successUrl)}">Continue</a>` : ""}</section>`,
    );
  }
  return layout(
    "Payment link expired",
    `<section class="box wide"><h2>This payment link has expired</h2>
<p>Go back and start again to get a fresh one.</p>
${session.cancel_url ? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>` : ""}</section>`,
  );
}

export function renderMissingPage(): string {
  return layout(
    "Not found",
    `<section class="box wide"><h2>No payment here</h2>
<p>This payment link is not known to the local test server. It may have been started before the server restarted.</p></section>`,
  );
}
