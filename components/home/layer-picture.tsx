import { LAYER_DEPTH_CM } from "@/lib/calc/facts";
import { PALETTE } from "@/components/ui/palette";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";

// The bed as built, drawn to scale from the default depths, with every label in dark ink on
// the light layers and light ink on the soil (each pair at 4.5:1 or better).
const PX_PER_CM = 6;
const straw = LAYER_DEPTH_CM.straw.default * PX_PER_CM;
const leaves = LAYER_DEPTH_CM.leaves.default * PX_PER_CM;
const BOARD = 20;
const SOIL = 34;
const TOP = 8;
const H = TOP + straw + leaves + BOARD + SOIL;

const layers = (system: UnitSystem) => [
  { y: TOP, h: straw, fill: PALETTE.litter[300], ink: PALETTE.humus[900], label: `straw, ${formatQuantity(LAYER_DEPTH_CM.straw.default, "cm", system)}` },
  { y: TOP + straw, h: leaves, fill: PALETTE.litter[500], ink: PALETTE.humus[900], label: `leaves, ${formatQuantity(LAYER_DEPTH_CM.leaves.default, "cm", system)}` },
  { y: TOP + straw + leaves, h: BOARD, fill: PALETTE.humus[300], ink: PALETTE.humus[900], label: "cardboard, one layer" },
];
const BUILT_CM = LAYER_DEPTH_CM.straw.default + LAYER_DEPTH_CM.leaves.default;

export function LayerPicture({ system }: { system: UnitSystem }) {
  return (
    <figure className="rounded-leaf bg-white p-5 shadow-sm ring-1 ring-humus-200">
      <svg viewBox={`0 0 320 ${H}`} role="img" aria-labelledby="layers-title" className="w-full">
        <title id="layers-title">A bed in layers: straw on top, then leaves, then one layer of cardboard, on the old soil</title>
        <path d={`M0 ${H - SOIL}h320v${SOIL}H0z`} fill={PALETTE.humus[700]} />
        {layers(system).map((l) => (
          <g key={l.label}>
            <rect x="16" y={l.y} width="288" height={l.h} fill={l.fill} />
            <text x="28" y={l.y + l.h / 2 + 5} fontSize="14" fontWeight="600" fill={l.ink}>
              {l.label}
            </text>
          </g>
        ))}
        <text x="28" y={H - SOIL / 2 + 5} fontSize="14" fontWeight="600" fill={PALETTE.humus[50]}>
          the old grass and soil, not dug
        </text>
      </svg>
      <figcaption className="mt-2 text-sm text-humus-700">Drawn to scale: about {formatQuantity(BUILT_CM, "cm", system)} deep when built, half that by the time you plant into it.</figcaption>
    </figure>
  );
}
