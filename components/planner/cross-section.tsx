import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { crossSectionLayout, LAYER_COLOURS, LAYER_TEXT, type LayerDepths } from "./cross-section-layout";

/** The bed's layers drawn to scale vertically, with a scale bar. */
export function CrossSection({ depths, system }: { depths: LayerDepths; system: UnitSystem }) {
  const { layers, pxPerCm, height, soilTop, bands } = crossSectionLayout(depths);
  const title = `Cross-section: ${layers.map((l) => `${l.label} ${formatQuantity(l.cm, "cm", system)}`).join(", ")} on the old soil`;
  return (
    <figure className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <svg viewBox={`0 0 360 ${height}`} role="img" aria-labelledby="xsec-title" className="w-full">
        <title id="xsec-title">{title}</title>
        <rect x="0" y={soilTop} width="360" height={height - soilTop} fill={LAYER_COLOURS.soil} />
        <text x="8" y={height - 12} fill="#f7f3ee" fontSize="12">old soil (not dug)</text>
        {bands.map((b) => (
          <g key={b.key} data-layer={b.key}>
            <rect x="40" y={b.y} width="250" height={b.h} fill={LAYER_COLOURS[b.key]} stroke="#3b2b1d" strokeWidth="0.5" />
            <text x="296" y={b.y + b.h / 2 + 4} fontSize="11" fill="#271c13">
              {b.label}
            </text>
            {b.h > 14 ? (
              <text x="48" y={b.y + b.h / 2 + 4} fontSize="11" fill={LAYER_TEXT[b.key]}>
                {formatQuantity(b.cm, "cm", system)}
              </text>
            ) : null}
          </g>
        ))}
        <g aria-hidden="true">
          <line x1="16" x2="16" y1={soilTop} y2={soilTop - 10 * pxPerCm} stroke="#271c13" strokeWidth="2" />
          <text x="4" y={soilTop - 10 * pxPerCm - 4} fontSize="10" fill="#271c13">
            {system === "metric" ? "10 cm" : "3.9 in"}
          </text>
        </g>
      </svg>
      <figcaption className="mt-1 text-sm text-humus-600">Depths to scale (cardboard thickness is nominal). Layers settle by about a third in the first months.</figcaption>
    </figure>
  );
}
