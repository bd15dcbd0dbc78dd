import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { CARDBOARD_DRAW_CM, crossSectionLayout, LAYER_COLOURS, LAYER_TEXT, type LayerDepths } from "./cross-section-layout";

const WHEN: Record<number, string> = { 3: "3 months", 6: "6 months", 12: "a year" };

/** The bed's layers drawn to scale vertically, with a scale bar and where the top will have sunk to. */
export function CrossSection({ depths, system, settling }: { depths: LayerDepths; system: UnitSystem; settling?: { built_depth_cm: number; after: { months: number; depth_cm: number }[] } }) {
  const { layers, pxPerCm, height, soilTop, bands } = crossSectionLayout(depths);
  const base = soilTop - (depths.cardboard ? CARDBOARD_DRAW_CM * pxPerCm : 0);
  const sunk = settling && settling.built_depth_cm > 0 ? settling.after : [];
  const title = `Cross-section: ${layers.map((l) => `${l.label} ${formatQuantity(l.cm, "cm", system)}`).join(", ")} on the old soil`;
  return (
    <figure className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <svg viewBox={`0 0 360 ${height}`} role="img" aria-labelledby="xsec-title" className="w-full">
        <title id="xsec-title">{title}</title>
        <rect x="0" y={soilTop} width="360" height={height - soilTop} fill={LAYER_COLOURS.soil} />
        <text x="8" y={height - 12} fill="#f7f3ee" fontSize="15">old soil (not dug)</text>
        {bands.map((b) => (
          <g key={b.key} data-layer={b.key}>
            <rect x="40" y={b.y} width="200" height={b.h} fill={LAYER_COLOURS[b.key]} stroke="#3b2b1d" strokeWidth="0.5" />
            <text x="248" y={b.y + b.h / 2 + 5} fontSize="15" fill="#271c13">
              {b.label}
            </text>
            {b.h > 18 ? (
              <text x="48" y={b.y + b.h / 2 + 5} fontSize="15" fill={LAYER_TEXT[b.key]}>
                {formatQuantity(b.cm, "cm", system)}
              </text>
            ) : null}
          </g>
        ))}
        {sunk.map((s) => (
          <g key={s.months} aria-hidden="true" data-settled={s.months}>
            <line x1="40" x2="240" y1={base - s.depth_cm * pxPerCm} y2={base - s.depth_cm * pxPerCm} stroke="#271c13" strokeWidth="1" strokeDasharray="4 3" />
            <text x="236" y={base - s.depth_cm * pxPerCm - 3} fontSize="13" textAnchor="end" fill="#271c13">
              {s.months === 12 ? "1 yr" : `${s.months} mo`}
            </text>
          </g>
        ))}
        <g aria-hidden="true">
          <line x1="16" x2="16" y1={soilTop} y2={soilTop - 10 * pxPerCm} stroke="#271c13" strokeWidth="2" />
          <text x="4" y={soilTop - 10 * pxPerCm - 5} fontSize="13" fill="#271c13">
            {system === "metric" ? "10 cm" : "3.9 in"}
          </text>
        </g>
      </svg>
      <figcaption className="mt-1 text-sm text-humus-600">
        Depths to scale (cardboard thickness is nominal).
        {sunk.length
          ? ` Dashed: about where the top sinks to as it settles (common practice) — ${sunk.map((s) => `${formatQuantity(s.depth_cm, "cm", system)} after ${WHEN[s.months] ?? `${s.months} months`}`).join(", ")}, from ${formatQuantity(settling!.built_depth_cm, "cm", system)} as built.`
          : ""}
      </figcaption>
    </figure>
  );
}
