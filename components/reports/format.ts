export type ChartUnit = "kg" | "m³";

/** A figure as the reports write it: whole kg from 100 up, else one place; m³ to two places. */
export function formatFigure(n: number, unit: ChartUnit): string {
  if (unit === "m³") return n.toLocaleString("en-GB", { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  return n >= 100 ? Math.round(n).toLocaleString("en-GB") : Number(n.toFixed(1)).toLocaleString("en-GB");
}

/** "1,234 kg" or "12.3 kg": whole kilograms once there are enough of them. */
export function formatKg(kg: number): string {
  return `${formatFigure(kg, "kg")} kg`;
}
