"use client";
import { useEffect, useId, useRef, useState } from "react";
import { usePathname } from "next/navigation";

/**
 * The state of a button that opens a panel below it (the header's menus, the phone menu). It
 * closes on Escape (the focus goes back to the button), on a click outside, and when a link in
 * it is followed (a new page).
 */
export function usePopupMenu<P extends HTMLElement>() {
  const [open, setOpen] = useState(false);
  const id = useId();
  const button = useRef<HTMLButtonElement>(null);
  const panel = useRef<P>(null);
  const pathname = usePathname();

  const [seen, setSeen] = useState(pathname);
  if (seen !== pathname) {
    setSeen(pathname);
    setOpen(false);
  }

  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape") return;
      setOpen(false);
      button.current?.focus();
    };
    const onPointer = (e: PointerEvent) => {
      const t = e.target as Node;
      if (!panel.current?.contains(t) && !button.current?.contains(t)) setOpen(false);
    };
    document.addEventListener("keydown", onKey);
    document.addEventListener("pointerdown", onPointer);
    return () => {
      document.removeEventListener("keydown", onKey);
      document.removeEventListener("pointerdown", onPointer);
    };
  }, [open]);

  return { open, toggle: () => setOpen((o) => !o), id, button, panel, pathname };
}
