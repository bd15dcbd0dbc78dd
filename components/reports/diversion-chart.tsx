"use client";

// Stacked bars by material, drawn by Recharts. A client component: Recharts measures its box in
// the browser, so the chart sits in a box of fixed height and ResponsiveContainer fills its
// width. The same figures are in a sentence under the chart and in the page's table, so nothing
// depends on seeing the bars or telling their colours apart.
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { chartSummary, type ChartColumn, type ChartSeries } from "./chart-summary";
import { formatFigure, type ChartUnit } from "./format";

const HEIGHT = 280;

export function DiversionChart({ id, title, unit, columns, series }: { id: string; title: string; unit: ChartUnit; columns: ChartColumn[]; series: ChartSeries[] }) {
  const used = series.filter((s) => columns.some((c) => (c.values[s.key] ?? 0) > 0));
  const rows = columns.map((c) => ({ label: c.label, ...c.values }));
  const summary = chartSummary(columns, series, unit);
  return (
    <figure className="flex flex-col gap-2" aria-labelledby={`${id}-title`} aria-describedby={`${id}-summary`}>
      <figcaption id={`${id}-title`} className="font-medium">
        {title}
      </figcaption>
      <div style={{ width: "100%", height: HEIGHT }} className="overflow-hidden" data-testid={`${id}-chart`}>
        <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 640, height: HEIGHT }}>
          {/* No keyboard layer: it would mark the chart role="application"; the sentence below and the page's table carry the figures. */}
          <BarChart data={rows} margin={{ top: 8, right: 12, bottom: 4, left: 8 }} title={title} desc={summary} accessibilityLayer={false}>
            <CartesianGrid stroke="#d9c6ad" vertical={false} />
            <XAxis dataKey="label" tick={{ fill: "#271c13", fontSize: 12 }} />
            <YAxis
              width={64}
              tick={{ fill: "#523c27", fontSize: 12 }}
              tickFormatter={(v: number) => formatFigure(v, unit)}
              label={{ value: unit, angle: -90, position: "insideLeft", fill: "#523c27", fontSize: 12 }}
            />
            <Tooltip formatter={(v) => `${formatFigure(Number(v), unit)} ${unit}`} />
            {/* Legend words in the page's text colour (over 12:1), the swatch beside them in the bar's. */}
            <Legend formatter={(value: string) => <span style={{ color: "#271c13" }}>{value}</span>} />
            {used.map((s) => (
              <Bar key={s.key} dataKey={s.key} name={s.label} stackId="material" fill={s.color} isAnimationActive={false} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <p id={`${id}-summary`} className="text-sm text-humus-700">
        {summary}.
      </p>
    </figure>
  );
}
