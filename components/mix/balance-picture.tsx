import { CN_RATIO, MATERIALS, type MaterialCode } from "@/lib/calc/facts";
import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";

// Browns (carbon-rich: board, leaves, straw, chips) against greens (nitrogen-rich: clippings,
// grounds, manure) as a beam that tips toward the side there is too much of. Level inside
// the composting range.
export interface Side {
  material: MaterialCode | undefined;
  kg: number;
  cn: number | undefined;
}

const MIDDLE = (CN_RATIO.ideal_min + CN_RATIO.ideal_max) / 2;

export function isBrown(cn: number | undefined): boolean {
  return cn !== undefined && cn > MIDDLE;
}

function tilt(cn: number): number {
  if (cn >= CN_RATIO.ideal_min && cn <= CN_RATIO.ideal_max) return 0;
  const off = cn > CN_RATIO.ideal_max ? Math.log(cn / CN_RATIO.ideal_max) : -Math.log(CN_RATIO.ideal_min / cn);
  return Math.max(-14, Math.min(14, off * 30));
}

function Pan({ x, y, items, label }: { x: number; y: number; items: Side[]; label: string }) {
  const total = items.reduce((s, i) => s + i.kg, 0) || 1;
  // Each material's share of the pan, laid end to end from the pan's left edge.
  const starts = items.map((_, k) => x - 50 + (items.slice(0, k).reduce((s, i) => s + i.kg, 0) / total) * 100);
  return (
    <g>
      <line x1={x} y1={y} x2={x - 40} y2={y + 34} stroke={PALETTE.humus[700]} />
      <line x1={x} y1={y} x2={x + 40} y2={y + 34} stroke={PALETTE.humus[700]} />
      <path d={`M${x - 52} ${y + 34}h104l-10 14h-84z`} fill={PALETTE.humus[200]} stroke={PALETTE.humus[700]} />
      {items.map((i, k) => (
        <rect key={k} x={starts[k]} y={y + 22} width={Math.max((i.kg / total) * 100, 2)} height="12" fill={i.material ? MATERIAL_COLOURS[i.material] : PALETTE.humus[400]} />
      ))}
      <text x={x} y={y + 66} fontSize="13" fontWeight="700" textAnchor="middle" fill={PALETTE.humus[900]}>
        {label}
      </text>
    </g>
  );
}

export function BalancePicture({ cn, parts }: { cn: number; parts: Side[] }) {
  const browns = parts.filter((p) => isBrown(p.cn));
  const greens = parts.filter((p) => !isBrown(p.cn));
  const kg = (list: Side[]) => list.reduce((s, p) => s + p.kg, 0);
  const angle = tilt(cn);
  const verdict = angle > 0 ? "Heavy on browns" : angle < 0 ? "Heavy on greens" : "In balance";
  const rad = (angle * Math.PI) / 180;
  // The beam turns about the post; a positive angle drops the browns' end (left).
  const lx = 180 - 120 * Math.cos(rad);
  const ly = 40 + 120 * Math.sin(rad);
  const rx = 180 + 120 * Math.cos(rad);
  const ry = 40 - 120 * Math.sin(rad);
  const names = (list: Side[]) => list.map((p) => (p.material ? MATERIALS[p.material].name.toLowerCase() : "your own material")).join(", ") || "nothing yet";
  return (
    <figure className="flex flex-col gap-2 rounded-leaf bg-white p-4 ring-1 ring-humus-200" data-testid="balance">
      <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-semibold">{verdict}</span>
        <span className="text-sm text-humus-700">
          carbon : nitrogen {cn.toFixed(0)} : 1, aim for {CN_RATIO.ideal_min}–{CN_RATIO.ideal_max}
        </span>
      </figcaption>
      <svg viewBox="0 0 360 150" className="w-full" role="img" aria-label={`${verdict}. Browns: ${names(browns)}, ${kg(browns).toFixed(1)} kg. Greens: ${names(greens)}, ${kg(greens).toFixed(1)} kg.`}>
        <path d="M180 40l-16 100h32z" fill={PALETTE.humus[500]} />
        <line x1={lx} y1={ly} x2={rx} y2={ry} stroke={PALETTE.humus[800]} strokeWidth="5" strokeLinecap="round" />
        <circle cx="180" cy="40" r="6" fill={PALETTE.humus[900]} />
        <Pan x={lx} y={ly} items={browns} label={`browns ${kg(browns).toFixed(1)} kg`} />
        <Pan x={rx} y={ry} items={greens} label={`greens ${kg(greens).toFixed(1)} kg`} />
      </svg>
      <p className="text-sm text-humus-800">
        <span className="font-medium">Browns:</span> {names(browns)}. <span className="font-medium">Greens:</span> {names(greens)}.
      </p>
    </figure>
  );
}
