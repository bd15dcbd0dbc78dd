import type { ListingUnit } from "@/lib/calc/units";
import type { MaterialCode } from "@/lib/calc/facts";
import { MATERIAL_COLOURS, PALETTE } from "@/components/ui/palette";

// A row of the things a listing comes in (bags, bales, sheets, a tub, a heap), as many as the
// amount: one drawing a unit up to ten, past that each drawing stands for several, and the
// caption says how many.
type Glyph = "bag" | "bale" | "sheet" | "tub" | "heap";

export function glyphFor(material: MaterialCode, unit: ListingUnit): Glyph {
  if (material === "worms") return "tub";
  if (unit === "bags") return "bag";
  if (unit === "bales") return "bale";
  if (unit === "sheets" || unit === "m2") return "sheet";
  return "heap";
}

const INK = PALETTE.humus[800];

export function GlyphShape({ glyph, fill, x = 0 }: { glyph: Glyph; fill: string; x?: number }) {
  switch (glyph) {
    case "bag":
      return (
        <g transform={`translate(${x} 0)`}>
          <path d="M5 7h10l2 15H3z" fill={fill} stroke={INK} strokeWidth="1" />
          <path d="M6 7c1-3 7-3 8 0" fill="none" stroke={INK} strokeWidth="1.2" />
        </g>
      );
    case "bale":
      return (
        <g transform={`translate(${x} 0)`}>
          <rect x="1" y="9" width="18" height="13" rx="1.5" fill={fill} stroke={INK} strokeWidth="1" />
          <path d="M7 9v13M13 9v13" stroke={INK} strokeWidth="1.2" />
        </g>
      );
    case "sheet":
      return (
        <g transform={`translate(${x} 0)`}>
          <path d="M4 14h15l-3 8H1z" fill={fill} stroke={INK} strokeWidth="1" />
          <path d="M4 11h15l-3 8" fill="none" stroke={INK} strokeWidth="0.8" opacity="0.6" />
        </g>
      );
    case "tub":
      return (
        <g transform={`translate(${x} 0)`}>
          <path d="M3 10h14l-1.5 12h-11z" fill={fill} stroke={INK} strokeWidth="1" />
          <rect x="2" y="7.5" width="16" height="3" rx="1" fill={PALETTE.humus[200]} stroke={INK} strokeWidth="1" />
        </g>
      );
    default:
      return (
        <g transform={`translate(${x} 0)`}>
          <path d="M1 22c2-9 5-13 9-13s7 4 9 13z" fill={fill} stroke={INK} strokeWidth="1" />
        </g>
      );
  }
}

const GLYPH_WORDS: Record<Glyph, [string, string]> = {
  bag: ["bag", "bags"],
  bale: ["bale", "bales"],
  sheet: ["sheet", "sheets"],
  tub: ["tub", "tubs"],
  heap: ["heap", "heaps"],
};

/** How many drawings, and what each stands for, for `amount` units. */
export function drawingPlan(amount: number, unit: ListingUnit): { drawn: number; each: number | null } {
  const counted = unit === "bags" || unit === "bales" || unit === "sheets";
  if (!counted) return { drawn: 1, each: null };
  const whole = Math.max(0, Math.ceil(amount));
  if (whole <= 10) return { drawn: whole, each: 1 };
  const each = Math.ceil(whole / 10);
  return { drawn: Math.ceil(whole / each), each };
}

export function UnitDrawing({ material, unit, amount, className = "" }: { material: MaterialCode; unit: ListingUnit; amount: number; className?: string }) {
  const glyph = glyphFor(material, unit);
  const { drawn, each } = drawingPlan(amount, unit);
  const fill = MATERIAL_COLOURS[material] ?? PALETTE.humus[400];
  const width = Math.max(1, drawn) * 21;
  return (
    <span className={`flex flex-col gap-0.5 ${className}`.trim()}>
      <svg viewBox={`0 0 ${width} 24`} width={Math.min(width, 210)} height={24} aria-hidden="true" className="max-w-full">
        {Array.from({ length: Math.max(1, drawn) }, (_, i) => (
          <GlyphShape key={i} glyph={glyph} fill={fill} x={i * 21} />
        ))}
      </svg>
      {each && each > 1 ? <span className="text-xs text-humus-600">each drawing is {each} {GLYPH_WORDS[glyph][1]}</span> : null}
    </span>
  );
}
