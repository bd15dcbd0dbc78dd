// What a gardener can go on before collecting from someone, in our own words: whether the
// Duffbank team has checked them, how often people have collected from them, and what those
// people said afterwards, as plain figures.
export interface TrustFacts {
  verified: boolean;
  collections?: number;
  rating?: { average: number; count: number } | null;
}

export function trustWords(s: TrustFacts): string[] {
  const words: string[] = [];
  if (s.verified) words.push("checked by Duffbank");
  const n = s.collections ?? 0;
  words.push(n === 0 ? "no collections yet" : n === 1 ? "collected from once" : `collected from ${n} times`);
  if (s.rating) words.push(`gardeners give ${s.rating.average.toFixed(1)} of 5 (${s.rating.count} ${s.rating.count === 1 ? "review" : "reviews"})`);
  return words;
}

/** The leaf-stamp mark: a pressed leaf in a ring, for suppliers the team has met or checked. */
function CheckedMark() {
  return (
    <svg viewBox="0 0 20 20" className="h-4 w-4 shrink-0" aria-hidden="true">
      <circle cx="10" cy="10" r="8.5" fill="none" stroke="#40642e" strokeWidth="1.5" strokeDasharray="2.5 1.5" />
      <path d="M6 14c0-5 3-8 8-8 0 5-3 8-8 8z" fill="#537e3c" />
      <path d="M6.5 13.5l5-5" stroke="#f1f6ee" strokeWidth="1" />
    </svg>
  );
}

export function TrustMarks({ supplier, className = "" }: { supplier: TrustFacts; className?: string }) {
  const [first, ...rest] = trustWords(supplier);
  return (
    <span className={`text-sm text-humus-700 ${className}`.trim()} data-testid="trust">
      {supplier.verified ? (
        <span className="inline-flex items-center gap-1 align-middle font-medium text-moss-800">
          <CheckedMark />
          {first}
        </span>
      ) : (
        first
      )}
      {rest.map((w) => ` · ${w}`).join("")}
    </span>
  );
}
