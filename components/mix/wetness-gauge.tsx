import { MOISTURE_PCT } from "@/lib/calc/facts";
import { PALETTE } from "@/components/ui/palette";

// How wet the mix is, as the squeeze test a composter does with a handful, on a gauge from
// dust-dry to dripping. The bands are the target moisture of the facts table.
export function squeezeWords(pct: number): { band: string; words: string } {
  if (pct < MOISTURE_PCT.min) return { band: "Too dry", words: "A squeezed handful crumbles apart and leaves your palm dry. Soak it as you build." };
  if (pct < MOISTURE_PCT.ideal_min) return { band: "A little dry", words: "A squeeze holds together but gives no drops. A little more water." };
  if (pct <= MOISTURE_PCT.ideal_max) return { band: "Just right", words: "Like a wrung-out sponge: a squeeze gives a few drops, no steady drip." };
  if (pct <= MOISTURE_PCT.max) return { band: "A little wet", words: "A squeeze gives a trickle. Mix in something dry, like leaves or torn board." };
  return { band: "Too wet", words: "Water runs out when you squeeze, and it will smell. Add dry browns and let it drain." };
}

const X0 = 10;
const W = 340;
const at = (pct: number) => X0 + (Math.min(Math.max(pct, 0), 100) / 100) * W;

export function WetnessGauge({ pct, target }: { pct: number; target?: number }) {
  const { band, words } = squeezeWords(pct);
  const mark = at(pct);
  return (
    <figure className="flex flex-col gap-2 rounded-leaf bg-white p-4 ring-1 ring-humus-200" data-testid="wetness">
      <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-semibold">How wet: {band}</span>
        <span className="text-sm text-humus-700">{pct.toFixed(0)} % water by weight</span>
      </figcaption>
      <svg viewBox="0 0 360 64" className="w-full" role="img" aria-label={`Moisture ${pct.toFixed(0)} per cent: ${band.toLowerCase()}. Aim for ${MOISTURE_PCT.ideal_min} to ${MOISTURE_PCT.ideal_max} per cent.`}>
        <defs>
          <linearGradient id="wet-ground" x1="0" x2="1">
            <stop offset="0" stopColor={PALETTE.litter[100]} />
            <stop offset="0.55" stopColor={PALETTE.moss[100]} />
            <stop offset="1" stopColor={PALETTE.humus[300]} />
          </linearGradient>
        </defs>
        <rect x={X0} y="18" width={W} height="16" rx="8" fill="url(#wet-ground)" stroke={PALETTE.humus[300]} />
        <rect x={at(MOISTURE_PCT.min)} y="18" width={at(MOISTURE_PCT.max) - at(MOISTURE_PCT.min)} height="16" fill={PALETTE.moss[200]} />
        <rect x={at(MOISTURE_PCT.ideal_min)} y="18" width={at(MOISTURE_PCT.ideal_max) - at(MOISTURE_PCT.ideal_min)} height="16" fill={PALETTE.moss[500]} />
        {target !== undefined ? <line x1={at(target)} x2={at(target)} y1="14" y2="38" stroke={PALETTE.moss[800]} strokeDasharray="3 2" strokeWidth="1.5" /> : null}
        <text x={X0} y="52" fontSize="12" fill={PALETTE.humus[700]}>
          dust-dry
        </text>
        <text x={at(55)} y="52" fontSize="12" textAnchor="middle" fill={PALETTE.moss[800]}>
          wrung sponge
        </text>
        <text x={X0 + W} y="52" fontSize="12" textAnchor="end" fill={PALETTE.humus[700]}>
          dripping
        </text>
        {/* A drop on the gauge where this mix is. */}
        <path d={`M${mark} 6c-4 6-6 9-6 12a6 6 0 0 0 12 0c0-3-2-6-6-12z`} fill={PALETTE.humus[900]} />
      </svg>
      <p className="text-sm text-humus-800" data-testid="squeeze">
        Squeeze test: {words}
      </p>
    </figure>
  );
}
