import { STATUS_LABELS } from "@/lib/listings/format";

const TONE: Record<string, string> = {
  active: "bg-moss-100 text-moss-800",
  draft: "bg-humus-100 text-humus-800",
  paused: "bg-litter-100 text-humus-900",
  gone: "bg-humus-100 text-humus-700",
  expired: "bg-humus-100 text-humus-700",
  archived: "bg-humus-200 text-humus-800",
  hidden: "bg-ember-100 text-ember-800",
};

export function StatusBadge({ status }: { status: string }) {
  return <span className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-medium ${TONE[status] ?? TONE.draft}`}>{STATUS_LABELS[status] ?? status}</span>;
}

/** The badge moderators give suppliers they have checked. */
export function VerifiedBadge() {
  return (
    <span className="inline-flex items-center gap-1 rounded-full bg-moss-600 px-2 py-0.5 text-xs font-semibold text-white" title="Checked by the Duffbank team">
      <svg viewBox="0 0 16 16" className="h-3 w-3" aria-hidden="true">
        <path d="M3 8.5l3 3 7-7" stroke="currentColor" strokeWidth="2.5" fill="none" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      Verified
    </span>
  );
}
