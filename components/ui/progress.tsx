/** How far a piece of long work has got (an upload, an import), in the palette, announced with its label. */
export function Progress({ value, max = 100, label, className = "" }: { value: number | null; max?: number; label: string; className?: string }) {
  const share = value === null ? null : Math.max(0, Math.min(1, value / max));
  return (
    <div className={`flex flex-col gap-1 ${className}`.trim()}>
      <div className="flex justify-between text-sm text-humus-700">
        <span>{label}</span>
        {share !== null ? <span>{Math.round(share * 100)} %</span> : null}
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={max}
        aria-valuenow={value ?? undefined}
        className="h-2.5 overflow-hidden rounded-full bg-humus-200"
      >
        <div className={`h-full rounded-full bg-moss-600 transition-[width] ${share === null ? "w-1/3 animate-pulse" : ""}`} style={share === null ? undefined : { width: `${share * 100}%` }} />
      </div>
    </div>
  );
}
