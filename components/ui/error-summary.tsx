"use client";
import { useCallback, useEffect, useRef, useState } from "react";
import type { FieldErrors, FieldValues, Path, UseFormReturn } from "react-hook-form";
import { isApiError } from "@/lib/api/client";

// Errors where the eye is: when a form fails on submit, a summary at its top takes the focus,
// says what the server said (as it was sent), and links each problem to its field, however
// far down the form that field is. The fields keep their own messages too.

export interface SummaryItem {
  /** The id of the element the link moves to. */
  target: string;
  message: string;
}

/** Every message in react-hook-form's nested errors, with the field path it belongs to. */
export function flattenErrors(errors: FieldErrors, prefix = ""): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || key === "ref" || key === "root") continue;
    const path = prefix ? `${prefix}.${key}` : key;
    const v = value as { message?: unknown; type?: unknown };
    if (typeof v.message === "string" && v.message) out.push({ path, message: v.message });
    else if (typeof value === "object") out.push(...flattenErrors(value as FieldErrors, path));
  }
  return out;
}

/** Moves to a field: focus (scrolling it into view), or the nearest focusable thing inside it. */
export function focusTarget(id: string): boolean {
  const el = document.getElementById(id);
  if (!el) return false;
  const FOCUSABLE = "input:not([type=hidden]):not([disabled]), select, textarea, button, [tabindex]";
  // A group's error line (radios, a list of times): its first control.
  const within = el.matches(FOCUSABLE) ? el : (el.querySelector<HTMLElement>(FOCUSABLE) ?? el.closest("fieldset")?.querySelector<HTMLElement>(FOCUSABLE) ?? null);
  const target = within ?? el;
  if (!within) target.setAttribute("tabindex", "-1");
  target.focus({ preventScroll: true });
  target.scrollIntoView({ block: "center", behavior: "auto" });
  return true;
}

export function ErrorSummary({ title = "Please check the form", message, items, attempt }: { title?: string; message: string | null; items: SummaryItem[]; attempt: number }) {
  const ref = useRef<HTMLDivElement>(null);
  const focused = useRef(0);
  const shown = !!message || items.length > 0;
  useEffect(() => {
    // Only a new failed submit moves the focus; fixing fields one by one does not. The
    // attempt can be counted a render before react-hook-form hands over its errors, so the
    // focus waits until the summary is there for that attempt.
    if (attempt > focused.current && shown && ref.current) {
      focused.current = attempt;
      ref.current.focus({ preventScroll: true });
      ref.current.scrollIntoView({ block: "start", behavior: "auto" });
    }
  }, [attempt, shown]);
  if (!shown) return null;
  return (
    <div ref={ref} tabIndex={-1} role="alert" aria-labelledby="error-summary-title" data-error-summary className="scroll-mt-24 rounded-lg border-l-4 border-ember-600 bg-ember-100 p-4 text-ember-800">
      <h2 id="error-summary-title" className="font-semibold">
        {title}
      </h2>
      {message ? <p className="mt-1 text-sm">{message}</p> : null}
      {items.length ? (
        <ul className="mt-2 list-disc pl-5 text-sm">
          {items.map((i) => (
            <li key={`${i.target}:${i.message}`}>
              <a
                href={`#${i.target}`}
                className="underline underline-offset-2"
                onClick={(e) => {
                  if (focusTarget(i.target)) e.preventDefault();
                }}
              >
                {i.message}
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

export interface ErrorSummaryOptions {
  /** Where a field's link goes when it is not `field-<path>` (a map point, a group of radios). */
  target?: (path: string) => string | undefined;
  /** Words to put before a field's message ("Pickup point: …"). */
  label?: (path: string) => string | undefined;
  /** Fields whose messages the summary leaves out (shown elsewhere). */
  skip?: (path: string) => boolean;
}

/**
 * The summary's state for a react-hook-form form: `invalid` for handleSubmit's second
 * argument, `fail(err)` for a server answer (its field messages go beside the fields, its
 * message at the top, both as sent), `props` for <ErrorSummary>.
 */
export function useErrorSummary<T extends FieldValues>(form: UseFormReturn<T>, opts: ErrorSummaryOptions = {}) {
  const [attempt, setAttempt] = useState(0);
  const [message, setMessage] = useState<string | null>(null);
  const errors = form.formState.errors;
  const invalid = useCallback(() => {
    setMessage(null);
    setAttempt((a) => a + 1);
  }, []);
  const fail = useCallback(
    (err: unknown, fallback = "That did not work. Please try again.") => {
      if (isApiError(err) && err.fields) {
        for (const [path, msg] of Object.entries(err.fields)) form.setError(path as Path<T>, { type: "server", message: msg });
      }
      setMessage(isApiError(err) ? err.message : fallback);
      setAttempt((a) => a + 1);
    },
    [form],
  );
  const clear = useCallback(() => setMessage(null), []);
  const items: SummaryItem[] = flattenErrors(errors)
    .filter((e) => !opts.skip?.(e.path))
    .map((e) => {
      const label = opts.label?.(e.path);
      return { target: opts.target?.(e.path) ?? `field-${e.path}`, message: label ? `${label}: ${e.message}` : e.message };
    })
    .filter((item, i, all) => all.findIndex((o) => o.target === item.target && o.message === item.message) === i);
  return { props: { message, items, attempt }, invalid, fail, clear };
}
