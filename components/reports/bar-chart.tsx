// Small bar charts drawn as SVG, no chart library: a stacked column per category with a
// legend and the same numbers in a table, so the figures do not depend on seeing colour.

export interface ChartSeries {
  key: string;
  label: string;
  color: string;
}

export interface ChartColumn {
  label: string;
  values: Record<string, number>;
}

const W = 640;
const H = 260;
const PAD = { top: 16, right: 12, bottom: 36, left: 56 };

/** A round axis top at or above `max` (1, 2, 3, 4, 5, 6 or 8 times a power of ten), so the quarter lines read easily. */
export function niceMax(max: number): number {
  if (!(max > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(max));
  return ([1, 2, 3, 4, 5, 6, 8, 10].find((m) => m * p >= max) ?? 10) * p;
}

const fmt = (n: number) => (n >= 100 ? Math.round(n).toLocaleString("en-GB") : Number(n.toFixed(1)).toLocaleString("en-GB"));

export function StackedBarChart({ id, title, unit, columns, series }: { id: string; title: string; unit: string; columns: ChartColumn[]; series: ChartSeries[] }) {
  const totals = columns.map((c) => series.reduce((n, s) => n + (c.values[s.key] ?? 0), 0));
  const top = niceMax(Math.max(0, ...totals));
  const innerW = W - PAD.left - PAD.right;
  const innerH = H - PAD.top - PAD.bottom;
  const band = innerW / Math.max(1, columns.length);
  const barW = Math.min(56, band * 0.6);
  const y = (v: number) => PAD.top + innerH - (v / top) * innerH;
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * top);
  const used = series.filter((s) => columns.some((c) => (c.values[s.key] ?? 0) > 0));
  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby={`${id}-title ${id}-desc`} className="w-full">
        <title id={`${id}-title`}>{title}</title>
        <desc id={`${id}-desc`}>
          {columns.map((c, i) => `${c.label}: ${fmt(totals[i])} ${unit}`).join("; ")}
        </desc>
        {ticks.map((t) => (
          <g key={t}>
            <line x1={PAD.left} x2={W - PAD.right} y1={y(t)} y2={y(t)} stroke="#d9c6ad" strokeWidth={1} />
            <text x={PAD.left - 6} y={y(t) + 4} textAnchor="end" fontSize="11" fill="#523c27">
              {fmt(t)}
            </text>
          </g>
        ))}
        <text x={12} y={PAD.top + innerH / 2} fontSize="11" fill="#523c27" transform={`rotate(-90 12 ${PAD.top + innerH / 2})`} textAnchor="middle">
          {unit}
        </text>
        {columns.map((c, i) => {
          const x = PAD.left + band * i + (band - barW) / 2;
          let acc = 0;
          return (
            <g key={c.label}>
              {series.map((s) => {
                const v = c.values[s.key] ?? 0;
                if (v <= 0) return null;
                const y0 = y(acc + v);
                const h = y(acc) - y0;
                acc += v;
                return (
                  <rect key={s.key} x={x} y={y0} width={barW} height={Math.max(0.5, h)} fill={s.color}>
                    <title>{`${c.label}, ${s.label}: ${fmt(v)} ${unit}`}</title>
                  </rect>
                );
              })}
              <text x={x + barW / 2} y={H - PAD.bottom + 16} textAnchor="middle" fontSize="11" fill="#271c13">
                {c.label}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption>
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Legend">
          {used.map((s) => (
            <li key={s.key} className="flex items-center gap-2">
              <span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm" style={{ background: s.color }} />
              {s.label}
            </li>
          ))}
        </ul>
      </figcaption>
    </figure>
  );
}

// One colour per material, from the Duffbank palette (tailwind.config.ts).
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
