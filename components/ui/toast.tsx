"use client";
import { createContext, useCallback, useContext, useEffect, useRef, useState, type ReactNode } from "react";

type Tone = "done" | "problem";
interface Toast {
  id: number;
  tone: Tone;
  text: string;
}

const ToastContext = createContext<(text: string, tone?: Tone) => void>(() => {});

/** Short confirmations ("Saved", "Request sent") that go away by themselves, read out politely. */
export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const next = useRef(1);
  const show = useCallback((text: string, tone: Tone = "done") => {
    const id = next.current++;
    setToasts((t) => [...t, { id, tone, text }]);
  }, []);
  const dismiss = (id: number) => setToasts((t) => t.filter((x) => x.id !== id));
  return (
    <ToastContext.Provider value={show}>
      {children}
      <div aria-live="polite" className="pointer-events-none fixed inset-x-0 bottom-4 z-50 flex flex-col items-center gap-2 px-4">
        {toasts.map((t) => (
          <ToastItem key={t.id} toast={t} onDone={() => dismiss(t.id)} />
        ))}
      </div>
    </ToastContext.Provider>
  );
}

function ToastItem({ toast, onDone }: { toast: Toast; onDone: () => void }) {
  useEffect(() => {
    const t = setTimeout(onDone, 5000);
    return () => clearTimeout(t);
  }, [onDone]);
  return (
    <div
      role="status"
      className={`pointer-events-auto flex items-center gap-3 rounded-lg px-4 py-3 shadow-lg ring-1 ${toast.tone === "done" ? "bg-moss-800 text-white ring-moss-900" : "bg-ember-800 text-white ring-ember-600"}`}
    >
      <span>{toast.text}</span>
      <button type="button" onClick={onDone} className="rounded px-2 py-1 font-semibold underline underline-offset-4">
        Close
      </button>
    </div>
  );
}

export const useToast = () => useContext(ToastContext);
