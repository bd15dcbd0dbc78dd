"use client";
import Link from "next/link";
import type { NavLink } from "@/lib/auth/navigation";
import { NewCount } from "./new-count";
import { usePopupMenu } from "./use-popup-menu";

/**
 * One menu of the header's row: a button that opens its links below it. Escape closes it
 * and puts the focus back on the button; so do a click elsewhere and following a link.
 */
export function NavMenu({ label, links, counts = {} }: { label: string; links: NavLink[]; counts?: Record<string, number> }) {
  const waiting = links.reduce((n, l) => n + (counts[l.href] ?? 0), 0);
  const { open, toggle, id, button, panel, pathname } = usePopupMenu<HTMLUListElement>();
  const here = links.some((l) => pathname === l.href || pathname.startsWith(`${l.href}/`));

  return (
    <div className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={toggle}
        className={`flex min-h-11 items-center gap-1.5 whitespace-nowrap rounded-lg px-3 font-medium hover:bg-humus-100 ${here ? "text-moss-800 underline decoration-2 underline-offset-8" : "text-humus-800"}`}
      >
        {label}
        <NewCount n={waiting} />
        <span aria-hidden="true" className={`inline-block h-2 w-2 -translate-y-0.5 rotate-45 border-b-2 border-r-2 border-current transition ${open ? "translate-y-0.5 rotate-[225deg]" : ""}`} />
      </button>
      <ul ref={panel} id={id} hidden={!open} className="absolute left-0 z-[1100] mt-1 flex min-w-52 flex-col gap-0.5 rounded-leaf bg-white p-2 shadow-lg ring-1 ring-humus-200">
        {links.map((l) => (
          <li key={l.href}>
            <Link href={l.href} aria-current={pathname === l.href ? "page" : undefined} className="block whitespace-nowrap rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100">
              {l.label}
              <NewCount n={counts[l.href]} />
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
