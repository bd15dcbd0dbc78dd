// The charts' series and columns, and the chart in words. Plain values, so server pages can
// build them for the (client) chart component.
import { formatFigure, type ChartUnit } from "./format";

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
