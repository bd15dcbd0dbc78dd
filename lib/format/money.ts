// Money is integer cents plus a currency everywhere; this is how it reads, on every screen and
// in every e-mail. A fixed locale, so the server and the browser render the same string, and
// one Intl.NumberFormat a currency, made once and kept (building one costs far more than using it).
const money = new Map<string, Intl.NumberFormat>();

/** An amount (not cents) in `currency`, as en-GB writes it: "€4.50". */
function formatAmount(amount: number, currency: string): string {
  const code = currency.toUpperCase();
  let f = money.get(code);
  if (!f) money.set(code, (f = new Intl.NumberFormat("en-GB", { style: "currency", currency: code })));
  return f.format(amount);
}

/**
 * Integer cents as money: "€4.50". `zero` is what a screen says for nothing to pay ("free")
 * where it words a price that way; without it nothing reads "€0.00".
 */
export function formatMoney(cents: number, currency: string, opts: { zero?: string } = {}): string {
  if (cents === 0 && opts.zero !== undefined) return opts.zero;
  return formatAmount(cents / 100, currency);
}
