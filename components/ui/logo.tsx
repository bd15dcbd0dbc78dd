/** Duffbank's mark: three bands of forest-floor litter with a shoot coming through. */
export function LogoMark({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 48 48" className={className} aria-hidden="true" focusable="false">
      <rect x="2" y="2" width="44" height="44" rx="12" fill="#40642e" />
      <path d="M8 36c6-3 26-3 32 0v4H8z" fill="#3b2b1d" />
      <path d="M8 30c7-3.5 25-3.5 32 0v5c-7-3-25-3-32 0z" fill="#84633f" />
      <path d="M8 24.5c8-3.5 24-3.5 32 0V29c-7-3-25-3-32 0z" fill="#d9962b" />
      <path d="M24 24c0-6 1-10 5-13" stroke="#f1f6ee" strokeWidth="2.5" strokeLinecap="round" fill="none" />
      <path d="M29 11c-4 0-7 2-7 6 4 0 7-2 7-6z" fill="#bcd4ac" />
      <path d="M24.5 18c-3-2-6-2-8 0 2 2.5 5 2.5 8 0z" fill="#94b97c" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="flex items-center gap-2 font-bold tracking-tight text-humus-900">
      <LogoMark />
      <span className="text-xl">Duffbank</span>
    </span>
  );
}
