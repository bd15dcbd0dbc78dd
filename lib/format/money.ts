/** Integer cents and a currency as a person reads them: 500, "eur" → "€5.00". */
export function formatMoney(cents: number, currency: string): string {
  return new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() }).format(cents / 100);
}

/** "3 bags", "1 bag", "0.5 m³". */
export function formatGiveawayQuantity(quantity: number, unit: "bags" | "m3"): string {
  const n = Number(quantity.toFixed(2));
  if (unit === "m3") return `${n} m³`;
  return `${n} ${n === 1 ? "bag" : "bags"}`;
}
