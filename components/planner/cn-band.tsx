import { CN_RATIO } from "@/lib/calc/facts";

// C:N on a log scale from 10 to 600, so a wood-chip mix and a grass mix both fit.
const MIN = 10;
const MAX = 600;
const x = (v: number) => 8 + (Math.log(Math.min(Math.max(v, MIN), MAX) / MIN) / Math.log(MAX / MIN)) * 344;

export function CnBand({ value }: { value: number | null }) {
  return (
    <figure className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <svg viewBox="0 0 360 76" role="img" aria-labelledby="cn-title" className="w-full">
        <title id="cn-title">
          {value === null
            ? "No carbon-to-nitrogen figure for this mix"
            : `Carbon to nitrogen ${value.toFixed(0)} : 1; the composting range is ${CN_RATIO.ideal_min} to ${CN_RATIO.ideal_max}`}
        </title>
        <rect x="8" y="22" width="344" height="14" rx="7" fill="#ece3d6" />
        <rect x={x(CN_RATIO.min)} y="22" width={x(CN_RATIO.max) - x(CN_RATIO.min)} height="14" fill="#dde9d5" />
        <rect x={x(CN_RATIO.ideal_min)} y="22" width={x(CN_RATIO.ideal_max) - x(CN_RATIO.ideal_min)} height="14" fill="#6f9b55" />
        {[10, 25, 40, 100, 300, 600].map((t) => (
          <text key={t} x={x(t)} y="54" fontSize="12" textAnchor={t === MIN ? "start" : t === MAX ? "end" : "middle"} fill="#523c27">
            {t}
          </text>
        ))}
        <text x={x(32)} y="15" fontSize="12" textAnchor="middle" fill="#324e25">
          composting range
        </text>
        {value !== null ? (
          <g>
            <line x1={x(value)} x2={x(value)} y1="18" y2="40" stroke="#271c13" strokeWidth="3" />
            {/* Near either end the value reads inward, so it is never cut off. */}
            <text x={x(value)} y="70" fontSize="13" fontWeight="700" textAnchor={x(value) > 290 ? "end" : x(value) < 70 ? "start" : "middle"} fill="#271c13">
              this mix {value.toFixed(0)}
            </text>
          </g>
        ) : null}
      </svg>
    </figure>
  );
}
