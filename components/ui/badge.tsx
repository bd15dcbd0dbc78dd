import type { ReactNode } from "react";

// Small labels beside a name or a heading. Each tone pairs text and ground from the palette
// at 4.5:1 or better.
export const BADGE_TONES = {
  moss: "bg-moss-100 text-moss-800 ring-moss-300",
  solid: "bg-moss-700 text-white ring-moss-800",
  litter: "bg-litter-100 text-litter-700 ring-litter-300",
  humus: "bg-humus-100 text-humus-700 ring-humus-300",
  ember: "bg-ember-100 text-ember-800 ring-ember-600",
} as const;

export type BadgeTone = keyof typeof BADGE_TONES;

export function Badge({ tone = "humus", children, title, className = "" }: { tone?: BadgeTone; children: ReactNode; title?: string; className?: string }) {
  return (
    <span title={title} className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-medium ring-1 ${BADGE_TONES[tone]} ${className}`.trim()}>
      {children}
    </span>
  );
}
