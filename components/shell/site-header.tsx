import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { navFor } from "@/lib/auth/navigation";
import type { SessionUser } from "@/lib/auth/current-user";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { UnitSwitch } from "@/components/ui/unit-switch";
import { MobileMenu } from "./mobile-menu";

/** `counts`: a number to show beside a link (new alerts beside "My needs"). */
export function SiteHeader({ user, counts = {} }: { user: SessionUser | null; counts?: Record<string, number> }) {
  const links = navFor(user?.roles ?? null);
  return (
    <header className="border-b border-humus-200 bg-white">
      <a href="#main" className="skip-link">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-4 py-3">
        <Link href={user ? "/home" : "/"} className="rounded" aria-label={user ? "Duffbank: what is waiting for you" : "Duffbank home"}>
          <Wordmark />
        </Link>
        <MobileMenu>
          <NavList links={links} user={user} counts={counts} vertical />
          <UnitSwitch className="mt-3" />
        </MobileMenu>
        <div className="hidden items-center gap-3 md:flex">
          <NavList links={links} user={user} counts={counts} />
          <UnitSwitch />
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
