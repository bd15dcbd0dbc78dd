import { forwardRef, type InputHTMLAttributes, type ReactNode } from "react";

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  error?: string;
  hint?: ReactNode;
}

/** A labelled input whose error is linked by aria-describedby and announced when it appears. */
export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field({ label, name, error, hint, id, className = "", ...props }, ref) {
  const inputId = id ?? `field-${name}`;
  const errorId = `${inputId}-error`;
  const hintId = `${inputId}-hint`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-humus-600">
          {hint}
        </p>
      ) : null}
      <input
        ref={ref}
        id={inputId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`min-h-11 rounded-lg border bg-white px-3 py-2 ${error ? "border-ember-600" : "border-humus-300"} ${className}`}
        {...props}
      />
      <p id={errorId} aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {error ?? ""}
      </p>
    </div>
  );
});
