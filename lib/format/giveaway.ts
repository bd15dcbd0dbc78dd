/** "3 bags", "1 bag", "0.5 m³": a giveaway day's quantity in its own unit. */
export function formatGiveawayQuantity(quantity: number, unit: "bags" | "m3"): string {
  const n = Number(quantity.toFixed(2));
  if (unit === "m3") return `${n} m³`;
  return `${n} ${n === 1 ? "bag" : "bags"}`;
}
