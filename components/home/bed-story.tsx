import { BED_MONTHS, LAYER_DEPTH_CM, PLANT_INTO_MONTHS, SETTLED_SHARE, WORMS_AFTER_DAYS } from "@/lib/calc/facts";
import { PALETTE } from "@/components/ui/palette";
import type { UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";

// A bed's first year, told as the bed itself: built up in layers on the first day, worms in a
// week or two later, then sinking and darkening as it turns to soil. Heights follow the facts
// table's settling shares, so the picture and the planner agree.
const BUILT_CM = LAYER_DEPTH_CM.leaves.default + LAYER_DEPTH_CM.straw.default;
const PX_PER_CM = 3.2;

interface Stage {
  when: string;
  title: string;
  body: string | ((system: UnitSystem) => string);
  /** Share of the built depth still standing. */
  share: number;
  /** How far the layers have turned to soil, 0–1. */
  soil: number;
  board: boolean;
  worms?: boolean;
}

const STAGES: Stage[] = [
  { when: "Day one, morning", title: "Board on the grass", body: "Flattened cardboard straight on the ground, seams overlapped, tape and staples off. No digging.", share: 0, soil: 0, board: true },
  { when: "Day one, afternoon", title: "Leaves, straw, water", body: (system) =>
      `About ${formatQuantity(LAYER_DEPTH_CM.leaves.default, "cm", system)} of leaves, ${formatQuantity(LAYER_DEPTH_CM.straw.default, "cm", system)} of straw on top, soaked until a squeeze gives a few drops.`, share: 1, soil: 0, board: true },
  { when: `Days ${WORMS_AFTER_DAYS.min}–${WORMS_AFTER_DAYS.max}`, title: "Worms go in", body: "Once any warmth has passed, composting worms go in under the straw. Keep it moist.", share: 0.85, soil: 0.1, board: true, worms: true },
  { when: `Month ${BED_MONTHS.settling}`, title: "It settles", body: `Down to about ${Math.round(SETTLED_SHARE[3] * 100)} % of its height as it wets through and the worms work.`, share: SETTLED_SHARE[3], soil: 0.35, board: true, worms: true },
  { when: `Months ${PLANT_INTO_MONTHS.from}–${PLANT_INTO_MONTHS.until}`, title: "Plant into it", body: "The board has mostly broken down. Plant into pockets of compost; top up with leaves in autumn.", share: SETTLED_SHARE[6], soil: 0.65, board: false, worms: true },
  { when: `Month ${BED_MONTHS.ready}`, title: "Soil", body: "Most of what went on is dark, crumbly soil, full of life. Start the next bed.", share: SETTLED_SHARE[12], soil: 1, board: false, worms: true },
];

function mixHex(a: string, b: string, t: number): string {
  const p = (h: string, i: number) => parseInt(h.slice(1 + i * 2, 3 + i * 2), 16);
  return `#${[0, 1, 2].map((i) => Math.round(p(a, i) + (p(b, i) - p(a, i)) * t).toString(16).padStart(2, "0")).join("")}`;
}

function StageBed({ s }: { s: Stage }) {
  const H = 100;
  const ground = 74;
  const height = BUILT_CM * PX_PER_CM * s.share;
  const straw = s.share > 0 ? LAYER_DEPTH_CM.straw.default * PX_PER_CM * s.share : 0;
  const leaves = height - straw;
  const leafFill = mixHex(PALETTE.litter[500], PALETTE.humus[800], s.soil);
  const strawFill = mixHex(PALETTE.litter[300], PALETTE.humus[700], s.soil);
  return (
    <svg viewBox={`0 0 120 ${H}`} className="h-24 w-full" aria-hidden="true">
      <rect x="0" y={ground} width="120" height={H - ground} fill={PALETTE.humus[700]} />
      {s.board ? <rect x="10" y={ground - 3} width="100" height="3" fill={PALETTE.humus[400]} /> : null}
      {leaves > 0 ? <rect x="10" y={ground - 3 - leaves} width="100" height={leaves} fill={leafFill} /> : null}
      {straw > 0 ? <rect x="10" y={ground - 3 - height} width="100" height={straw} fill={strawFill} /> : null}
      {s.worms ? (
        <g stroke={PALETTE.ember[600]} strokeWidth="2" fill="none" strokeLinecap="round">
          <path d={`M30 ${ground - 8}c3-3 6 3 9 0`} />
          <path d={`M70 ${ground - 6}c3-3 6 3 9 0`} />
        </g>
      ) : null}
      {s.when.startsWith("Months") ? (
        <g>
          <path d={`M60 ${ground - 3 - height}v-14`} stroke={PALETTE.moss[600]} strokeWidth="2" />
          <path d={`M60 ${ground - 13 - height}c-7 0-10-4-10-8 6 0 10 3 10 8zM60 ${ground - 15 - height}c6 0 9-4 9-7-5 0-9 3-9 7z`} fill={PALETTE.moss[400]} />
        </g>
      ) : null}
      {s.soil >= 1 ? <path d={`M20 ${ground - 3 - height}c10-4 70-4 80 0`} stroke={PALETTE.moss[500]} strokeWidth="3" fill="none" /> : null}
    </svg>
  );
}

export function BedStory({ beds, bedAreaM2, system }: { beds: number; bedAreaM2: number; system: UnitSystem }) {
  return (
    <section aria-labelledby="story-title" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="story-title" className="text-2xl font-bold">
          A bed&apos;s first year
        </h2>
        {beds > 0 ? (
          <p className="text-humus-700" data-testid="beds-started">
            {beds.toLocaleString("en-GB")} {beds === 1 ? "bed" : "beds"} started on Duffbank so far, covering {formatQuantity(bedAreaM2, "m2", system)} of ground.
          </p>
        ) : null}
      </div>
      <ol tabIndex={0} aria-label="The first year, stage by stage" className="-mx-4 flex snap-x gap-0 overflow-x-auto px-4 pb-2 md:mx-0 md:grid md:grid-cols-6 md:overflow-visible md:px-0">
        {STAGES.map((s) => (
          <li key={s.when} className="flex w-44 shrink-0 snap-start flex-col gap-2 border-l-2 border-dashed border-humus-300 px-3 first:border-l-0 md:w-auto">
            <StageBed s={s} />
            <p className="text-sm font-semibold text-moss-800">{s.when}</p>
            <h3 className="font-semibold leading-snug">{s.title}</h3>
            <p className="text-sm text-humus-700">{typeof s.body === "function" ? s.body(system) : s.body}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}
