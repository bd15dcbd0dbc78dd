import { formatAmount } from "./amounts";
import type { CardField, CardForm } from "./test-cards";
import type { CheckoutSession, LineItem } from "./types";

// The hosted page the fake's Checkout Sessions point at. It is Duffbank's own plain page,
// self-contained (no scripts, fonts or images from anywhere), and says plainly that it
// is a local test page, so nobody mistakes it for a real payment form.

function esc(value: string): string {
  return value
    .replaceAll("&", "&amp;")
    .replaceAll("<", "&lt;")
    .replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;")
    .replaceAll("'", "&#39;");
}

const STYLE = `
  :root { color-scheme: light; --ink: #2b2218; --soil: #5a4632; --moss: #3f6b34; --paper: #f7f2e8; --line: #d9ccb4; --bad: #9b2c1c; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; color: var(--ink); background: var(--paper); }
  .banner { margin: 0; background: #f1d98a; color: #3a2d00; text-align: center; padding: .6rem 1rem; font-weight: 600; border-bottom: 2px dashed #b08a1a; }
  main { max-width: 30rem; margin: 2rem auto; padding: 0 1rem; }
  h1 { font-size: 1.4rem; margin: 0 0 .25rem; }
  .muted { color: var(--soil); font-size: .95rem; }
  .card { background: #fffdf8; border: 1px solid var(--line); border-radius: 10px; padding: 1.25rem; margin-top: 1rem; }
  table { width: 100%; border-collapse: collapse; }
  td { padding: .3rem 0; vertical-align: top; }
  td.amount { text-align: right; white-space: nowrap; }
  tr.total td { border-top: 1px solid var(--line); font-weight: 700; padding-top: .6rem; }
  label { display: block; font-weight: 600; margin-top: .9rem; }
  input { width: 100%; font: inherit; padding: .55rem .6rem; border: 1px solid #a8987c; border-radius: 6px; background: #fff; }
  input:focus { outline: 3px solid #9cc28f; outline-offset: 1px; }
  input[aria-invalid="true"] { border-color: var(--bad); }
  .row { display: flex; gap: .75rem; } .row > div { flex: 1; }
  .field-error { color: var(--bad); margin: .25rem 0 0; font-size: .9rem; }
  .alert { border: 1px solid var(--bad); background: #fbe9e4; color: var(--bad); border-radius: 6px; padding: .7rem .8rem; margin-top: 1rem; }
  button { margin-top: 1.25rem; width: 100%; font: inherit; font-weight: 700; padding: .75rem; border: 0; border-radius: 8px; background: var(--moss); color: #fff; cursor: pointer; }
  button:hover { background: #345a2b; } button:focus-visible { outline: 3px solid #2b2218; outline-offset: 2px; }
  .hint { font-size: .88rem; background: #eef3e8; border-radius: 6px; padding: .6rem .8rem; margin-top: 1rem; }
  .hint code { font-size: .85rem; }
  a { color: var(--moss); }
  .back { display: inline-block; margin-top: 1rem; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${esc(title)} · Duffbank local test payment</title>
<style>${STYLE}</style>
</head>
<body>
<p class="banner">Local test payment page — no real money. Nothing typed here leaves this computer.</p>
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
  { name: "card_number", label: "Card number", autocomplete: "cc-number", inputmode: "numeric", placeholder: "4242 4242 4242 4242" },
  { name: "expiry", label: "Expiry (MM/YY)", autocomplete: "cc-exp", inputmode: "numeric", placeholder: "12/34" },
  { name: "cvc", label: "CVC", autocomplete: "cc-csc", inputmode: "numeric", placeholder: "123" },
  { name: "name", label: "Name on card", autocomplete: "cc-name" },
];

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
    .map(
      (item) =>
        `<tr><td>${esc(item.description)}${item.quantity > 1 ? ` × ${item.quantity}` : ""}</td><td class="amount">${esc(
          formatAmount(item.amount_total, item.currency),
        )}</td></tr>`,
    )
    .join("\n");
  const fieldErrors = input.errors && Object.keys(input.errors).length > 0;
  const alert = input.problem
    ? `<div class="alert" role="alert">${esc(input.problem)}</div>`
    : fieldErrors
      ? `<div class="alert" role="alert">Some details need another look — see the notes under the fields.</div>`
      : "";
  const [number, expiry, cvc, name] = FIELDS;
  return layout(
    `Pay ${total}`,
    `<h1>Pay ${esc(total)}</h1>
<p class="muted">${
      input.captureLater
        ? "This places a hold on the card. The amount is reserved now and only taken later, if at all."
        : "The amount is taken from the card when you press Pay."
    }</p>
<section class="card" aria-labelledby="summary-heading">
  <h2 id="summary-heading" class="muted" style="font-size:1rem;margin:0 0 .5rem">What you are paying for</h2>
  <table>
${rows}
<tr class="total"><td>Total</td><td class="amount">${esc(total)}</td></tr>
  </table>
</section>
<form class="card" method="post" action="/pay/${esc(session.id)}" novalidate>
  ${alert}
  ${field(number, input)}
  <div class="row">${field(expiry, input)}${field(cvc, input)}</div>
  ${field(name, input)}
  <button type="submit">Pay ${esc(total)}</button>
  <div class="hint">
    Test cards: <code>4242 4242 4242 4242</code> is approved, <code>4000 0000 0000 0002</code> is declined,
    <code>4000 0000 0000 9995</code> is declined for insufficient funds. Use any future expiry and any 3-digit CVC.
  </div>
</form>
${session.cancel_url ? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>` : ""}`,
  );
}

/** For a session that can no longer be paid: already complete or expired. */
export function renderClosedPage(session: CheckoutSession, successUrl: string | null): string {
  if (session.status === "complete") {
    return layout(
      "Already paid",
      `<h1>This payment is already done</h1>
<p>Nothing more to pay here.</p>
${successUrl ? `<a class="back" href="${esc(successUrl)}">Continue</a>` : ""}`,
    );
  }
  return layout(
    "Payment link expired",
    `<h1>This payment link has expired</h1>
<p>Go back and start again to get a fresh one.</p>
${session.cancel_url ? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>` : ""}`,
  );
}

export function renderMissingPage(): string {
  return layout(
    "Not found",
    `<h1>No payment here</h1>
<p>This payment link is not known to the local test server. It may have been started before the server restarted.</p>`,
  );
}
