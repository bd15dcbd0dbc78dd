import type { ReactNode } from "react";

const TONES = {
  info: "border-moss-300 bg-moss-50 text-moss-900",
  caution: "border-litter-300 bg-litter-100 text-humus-900",
  error: "border-ember-600 bg-ember-100 text-ember-800",
} as const;

/** A boxed message. Errors are role="alert" so screen readers hear them at once. */
export function Notice({ tone = "info", title, children }: { tone?: keyof typeof TONES; title?: string; children: ReactNode }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-lg border-l-4 p-4 ${TONES[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      <div className="text-sm leading-relaxed">{children}</div>
    </div>
  );
}
