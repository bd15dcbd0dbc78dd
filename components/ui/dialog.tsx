"use client";
import { useEffect, useId, useRef, type ReactNode } from "react";

/**
 * A modal built on the browser's own <dialog>: focus is kept inside, Escape closes it, and
 * focus goes back to what opened it. The caller owns `open`.
 */
export function Dialog({ open, onClose, title, children, footer }: { open: boolean; onClose: () => void; title: string; children: ReactNode; footer?: ReactNode }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-leaf bg-white p-0 text-humus-900 shadow-xl ring-1 ring-humus-300 backdrop:bg-humus-900/50"
    >
      <div className="flex flex-col gap-4 p-6">
        <h2 id={titleId} className="text-xl font-semibold">
          {title}
        </h2>
        <div>{children}</div>
        <div className="flex flex-wrap justify-end gap-2">{footer}</div>
      </div>
    </dialog>
  );
}
