// One colour per material, from the Duffbank palette (tailwind.config.ts). Kept apart from the
// chart (a client component) so server pages can read it as a plain value.
export const MATERIAL_COLORS: Record<string, string> = {
  leaves: "#d9962b",
  straw: "#f0c36b",
  cardboard: "#a27f58",
  worms: "#b3401f",
  grass_clippings: "#6f9b55",
  coffee_grounds: "#3b2b1d",
  wood_chips: "#84633f",
  manure: "#523c27",
  compost: "#324e25",
};

export interface ChartSeries {
  key: string;
  label: string;
  color: string;
}

/** One column of a stacked chart: its label and a value per series key. */
export interface ChartColumn {
  label: string;
  values: Record<string, number>;
}

export type ChartUnit = "kg" | "m³";

/** A figure as the charts and their summaries write it: whole kg from 100 up, else one place; m³ to two places. */
export function formatFigure(n: number, unit: ChartUnit): string {
  if (unit === "m³") return n.toLocaleString("en-GB", { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  return n >= 100 ? Math.round(n).toLocaleString("en-GB") : Number(n.toFixed(1)).toLocaleString("en-GB");
}

/** The chart in words, for its visible summary and for screen readers: each column's total and its largest share. */
export function chartSummary(columns: ChartColumn[], series: ChartSeries[], unit: ChartUnit): string {
  const label = (key: string) => series.find((s) => s.key === key)?.label ?? key;
  return columns
    .map((c) => {
      const parts = Object.entries(c.values).filter(([, v]) => v > 0);
      const total = parts.reduce((n, [, v]) => n + v, 0);
      const detail = parts.length > 1 ? ` (${parts.map(([k, v]) => `${label(k)} ${formatFigure(v, unit)}`).join(", ")})` : parts.length === 1 ? ` of ${label(parts[0][0]).toLowerCase()}` : "";
      return `${c.label}: ${formatFigure(total, unit)} ${unit}${detail}`;
    })
    .join("; ");
}
