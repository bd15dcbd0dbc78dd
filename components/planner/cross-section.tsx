import { formatQuantity, type UnitSystem } from "@/lib/calc/units";

// Nominal thickness of one layer of corrugated board, for drawing only (from memory: single
// wall board is 3–5 mm).
const CARDBOARD_DRAW_CM = 0.5;

const COLOURS = { cardboard: "#a27f58", leaves: "#d9962b", straw: "#f0c36b", soil: "#523c27" };

/** The bed's layers drawn to scale vertically, with a scale bar. */
export function CrossSection({ depths, system }: { depths: { cardboard: boolean; leaves?: number; straw?: number }; system: UnitSystem }) {
  const layers = [
    ...(depths.cardboard ? [{ key: "cardboard", label: "cardboard", cm: CARDBOARD_DRAW_CM }] : []),
    ...(depths.leaves ? [{ key: "leaves", label: "leaves", cm: depths.leaves }] : []),
    ...(depths.straw ? [{ key: "straw", label: "straw", cm: depths.straw }] : []),
  ];
  const total = layers.reduce((s, l) => s + l.cm, 0);
  const pxPerCm = Math.min(8, 180 / Math.max(total, 10));
  const soilPx = 36;
  const height = total * pxPerCm + soilPx + 24;
  let y = height - soilPx;
  const bands = layers.map((l) => {
    const h = Math.max(l.cm * pxPerCm, 2);
    y -= h;
    return { ...l, y, h };
  });
  const title = `Cross-section: ${layers.map((l) => `${l.label} ${formatQuantity(l.cm, "cm", system)}`).join(", ")} on the old soil`;
  return (
    <figure className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <svg viewBox={`0 0 360 ${height}`} role="img" aria-labelledby="xsec-title" className="w-full">
        <title id="xsec-title">{title}</title>
        <rect x="0" y={height - soilPx} width="360" height={soilPx} fill={COLOURS.soil} />
        <text x="8" y={height - 12} fill="#f7f3ee" fontSize="12">old soil (not dug)</text>
        {bands.map((b) => (
          <g key={b.key}>
            <rect x="40" y={b.y} width="250" height={b.h} fill={COLOURS[b.key as keyof typeof COLOURS]} stroke="#3b2b1d" strokeWidth="0.5" />
            <text x="296" y={b.y + b.h / 2 + 4} fontSize="11" fill="#271c13">
              {b.label}
            </text>
            {b.h > 14 ? (
              <text x="48" y={b.y + b.h / 2 + 4} fontSize="11" fill="#271c13">
                {formatQuantity(b.cm, "cm", system)}
              </text>
            ) : null}
          </g>
        ))}
        <g aria-hidden="true">
          <line x1="16" x2="16" y1={height - soilPx} y2={height - soilPx - 10 * pxPerCm} stroke="#271c13" strokeWidth="2" />
          <text x="4" y={height - soilPx - 10 * pxPerCm - 4} fontSize="10" fill="#271c13">
            {system === "metric" ? "10 cm" : "3.9 in"}
          </text>
        </g>
      </svg>
      <figcaption className="mt-1 text-sm text-humus-600">Depths to scale (cardboard thickness is nominal). Layers settle by about a third in the first months.</figcaption>
    </figure>
  );
}
