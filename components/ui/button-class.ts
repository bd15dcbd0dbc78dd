// Button looks, shared by the Button component and by links styled as buttons (server pages).
const VARIANTS = {
  primary: "bg-moss-600 text-white hover:bg-moss-700 disabled:bg-moss-300",
  secondary: "bg-white text-humus-900 ring-1 ring-humus-300 hover:bg-humus-100",
  danger: "bg-ember-600 text-white hover:bg-ember-800",
  quiet: "text-moss-700 underline underline-offset-4 hover:text-moss-900",
} as const;

export type ButtonVariant = keyof typeof VARIANTS;

export function buttonClass(variant: ButtonVariant = "primary", extra = "") {
  const base = variant === "quiet" ? "" : "inline-flex items-center justify-center gap-2 rounded-lg px-4 py-2.5 font-semibold min-h-11";
  return `${base} ${VARIANTS[variant]} disabled:cursor-not-allowed ${extra}`.trim();
}

/** The small buttons beside a row (pause, close, dismiss …): plain, or red for what cannot be undone. */
export function smallButtonClass(tone: "plain" | "danger" = "plain") {
  const ring = tone === "danger" ? "text-ember-800 ring-ember-600/40 hover:bg-ember-100" : "ring-humus-300 hover:bg-humus-100";
  return `min-h-9 rounded-lg px-3 py-1.5 text-sm font-medium ring-1 disabled:opacity-50 ${ring}`;
}
