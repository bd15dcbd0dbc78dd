"use client";
import type { ReactNode } from "react";
import { usePopupMenu } from "./use-popup-menu";

/**
 * The phone menu: a button that opens the navigation below it. It closes on Escape (the
 * focus goes back to the button), on a click outside, and when a link in it is followed.
 */
export function MobileMenu({ children }: { children: ReactNode }) {
  const { open, toggle, id, button, panel } = usePopupMenu<HTMLDivElement>();

  return (
    <div className="relative md:hidden">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={toggle}
        className="flex min-h-11 items-center gap-2 rounded-lg px-3 font-medium ring-1 ring-humus-300"
      >
        <span aria-hidden="true">{open ? "✕" : "☰"}</span> Menu
      </button>
      <div ref={panel} id={id} hidden={!open} className="absolute right-0 z-[1100] mt-2 w-72 max-w-[calc(100vw-2rem)] rounded-lg bg-white p-3 shadow-lg ring-1 ring-humus-200">
        {children}
      </div>
    </div>
  );
}
