import type { ReactNode } from "react";

/** What a page shows when there is nothing yet: a picture, what to do next, and the way to do it. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <section className="flex flex-col items-center gap-3 rounded-leaf border border-dashed border-humus-300 bg-white/60 px-6 py-10 text-center">
      <svg viewBox="0 0 64 32" className="h-10 w-20" aria-hidden="true">
        <path d="M2 28c10-6 50-6 60 0" stroke="#c0a27f" strokeWidth="3" fill="none" strokeLinecap="round" />
        <path d="M10 22c8-5 36-5 44 0" stroke="#d9962b" strokeWidth="3" fill="none" strokeLinecap="round" />
        <path d="M32 18V6m0 0c3 0 6 2 6 5-3 0-6-2-6-5z" stroke="#537e3c" strokeWidth="2.5" fill="#94b97c" strokeLinecap="round" />
      </svg>
      <h2 className="text-lg font-semibold">{title}</h2>
      {children ? <div className="max-w-prose text-humus-700">{children}</div> : null}
      {action}
    </section>
  );
}

export function Spinner({ label = "Loading" }: { label?: string }) {
  return (
    <span role="status" className="inline-flex items-center gap-2 text-humus-600">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-moss-300 border-t-moss-700" aria-hidden="true" />
      {label}…
    </span>
  );
}

export function PageHeading({ title, lead }: { title: string; lead?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-col gap-2">
      <h1 className="text-3xl font-bold tracking-tight text-humus-900">{title}</h1>
      {lead ? <p className="max-w-prose text-humus-700">{lead}</p> : null}
    </header>
  );
}
