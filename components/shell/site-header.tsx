import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { navGroupsFor, type NavGroup, type NavLink } from "@/lib/auth/navigation";
import type { SessionUser } from "@/lib/auth/current-user";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { UnitSwitch } from "@/components/ui/unit-switch";
import { MobileMenu } from "./mobile-menu";
import { NavMenu } from "./nav-menu";
import { NewCount } from "./new-count";

/** `counts`: a number to show beside a link (new alerts beside "My needs"). */
export function SiteHeader({ user, counts = {} }: { user: SessionUser | null; counts?: Record<string, number> }) {
  const links = navGroupsFor(user?.roles ?? null);
  return (
    <header className="border-b border-humus-200 bg-white">
      <a href="#main" className="skip-link">
        Skip to content
      </a>
      <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-3">
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

const linkClass = "block whitespace-nowrap rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100";

/** The navigation: menus by task in the row, the same groups under headings in the phone menu. */
function NavList({ links, user, counts, vertical = false }: { links: (NavGroup | NavLink)[]; user: SessionUser | null; counts: Record<string, number>; vertical?: boolean }) {
  const org = user?.organisation?.name;
  return (
    <nav aria-label="Main">
      <ul className={`flex gap-1 ${vertical ? "flex-col" : "items-center justify-end"}`}>
        {links.map((entry) =>
          "links" in entry ? (
            <li key={entry.label}>
              {vertical ? (
                <>
                  <p className="px-3 pt-2 text-sm font-semibold text-humus-600">{entry.label}</p>
                  <ul>
                    {entry.links.map((l) => (
                      <li key={l.href}>
                        <Link href={l.href} className={linkClass}>
                          {l.label}
                          <NewCount n={counts[l.href]} />
                        </Link>
                      </li>
                    ))}
                  </ul>
                </>
              ) : (
                <NavMenu label={entry.label} links={entry.links} counts={counts} />
              )}
            </li>
          ) : (
            <li key={entry.href}>
              <Link href={entry.href} className={linkClass}>
                {entry.label}
                <NewCount n={counts[entry.href]} />
              </Link>
            </li>
          ),
        )}
        {user ? (
          <>
            <li className={vertical ? "border-t border-humus-200 pt-1" : "ml-2"}>
              {/* Long names, a council's especially, are cut short on screen; the whole name stays in the text (read out) and the title. */}
              <Link
                href="/profile"
                className="flex max-w-[13rem] flex-col rounded-lg px-3 py-1 leading-tight text-humus-800 hover:bg-humus-100"
                title={[user.name, org, user.roles.map((r) => ROLE_LABELS[r]).join(", ")].filter(Boolean).join(" · ")}
              >
                <span className="sr-only">Your profile: </span>
                <span className="truncate font-medium">{user.name}</span>
                {org ? <span className="truncate text-sm text-humus-600" data-testid="org-name">{org}</span> : null}
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
