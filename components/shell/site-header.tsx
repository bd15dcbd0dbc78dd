import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { navFor } from "@/lib/auth/navigation";
import type { SessionUser } from "@/lib/auth/current-user";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { SignOutButton } from "@/components/auth/sign-out-button";

/** `counts`: a number to show beside a link (new alerts beside "My needs"). */
export function SiteHeader({ user, counts = {} }: { user: SessionUser | null; counts?: Record<string, number> }) {
  const links = navFor(user?.roles ?? null);
  return (
    <header className="border-b border-humus-200 bg-white">
      <a href="#main" className="skip-link">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-4 py-3">
        <Link href="/" className="rounded" aria-label="Duffbank home">
          <Wordmark />
        </Link>
        <details className="group relative md:hidden">
          <summary className="flex min-h-11 cursor-pointer list-none items-center rounded-lg px-3 ring-1 ring-humus-300">Menu</summary>
          <div className="absolute right-0 z-40 mt-2 w-64 rounded-lg bg-white p-3 shadow-lg ring-1 ring-humus-200">
            <NavList links={links} user={user} counts={counts} vertical />
          </div>
        </details>
        <div className="hidden md:block">
          <NavList links={links} user={user} counts={counts} />
        </div>
      </div>
    </header>
  );
}

function NavList({ links, user, counts, vertical = false }: { links: { href: string; label: string }[]; user: SessionUser | null; counts: Record<string, number>; vertical?: boolean }) {
  return (
    <nav aria-label="Main">
      <ul className={`flex gap-1 ${vertical ? "flex-col" : "flex-wrap items-center justify-end"}`}>
        {links.map((l) => (
          <li key={l.href}>
            <Link href={l.href} className="block whitespace-nowrap rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100">
              {l.label}
              {counts[l.href] ? (
                <>
                  <span aria-hidden="true" className="ml-1.5 rounded-full bg-ember-600 px-1.5 py-0.5 text-xs font-semibold text-white">
                    {counts[l.href]}
                  </span>
                  <span className="sr-only">, {counts[l.href]} new</span>
                </>
              ) : null}
            </Link>
          </li>
        ))}
        {user ? (
          <>
            <li>
              <Link href="/profile" className="block max-w-[14rem] truncate rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100" title={user.roles.map((r) => ROLE_LABELS[r]).join(", ")}>
                {user.name}
              </Link>
            </li>
            <li>
              <SignOutButton />
            </li>
          </>
        ) : (
          <>
            <li>
              <Link href="/sign-in" className="block rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100">
                Sign in
              </Link>
            </li>
            <li>
              <Link href="/sign-up" className="block rounded-lg bg-moss-600 px-3 py-2 font-semibold text-white hover:bg-moss-700">
                Join
              </Link>
            </li>
          </>
        )}
      </ul>
    </nav>
  );
}
