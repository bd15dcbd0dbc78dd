// Numbers in a fixed locale (money is ./money.ts), so the server and the browser render the same string.
// Building an Intl.NumberFormat costs far more than using one (toLocaleString with options
// builds a new one every call), and an estimate or a plan formats hundreds of figures, so
// each formatter is made once and kept.

const numbers = new Map<number, Intl.NumberFormat>();

/** `value` in en-US digits with at most `decimals` decimals: 11,000 or 0.9. */
export function formatNumber(value: number, decimals: number): string {
  const d = Math.max(0, Math.min(20, Math.floor(decimals)));
  let f = numbers.get(d);
  if (!f) numbers.set(d, (f = new Intl.NumberFormat("en-US", { maximumFractionDigits: d })));
  return f.format(value);
}
