import type { HTMLAttributes, ReactNode } from "react";

const TONES = {
  plain: "bg-white ring-humus-200",
  soft: "bg-humus-50 ring-humus-200",
  picked: "bg-white ring-2 ring-litter-500",
} as const;

/** A white (or soft) box for one thing: a listing, an order, a result. Panel adds a titled section. */
export function Card({ tone = "plain", as: Tag = "div", className = "", children, ...props }: HTMLAttributes<HTMLElement> & { tone?: keyof typeof TONES; as?: "div" | "article" | "section" | "li"; children: ReactNode }) {
  return (
    <Tag className={`rounded-leaf p-4 ring-1 ${TONES[tone]} ${className}`.trim()} {...props}>
      {children}
    </Tag>
  );
}
