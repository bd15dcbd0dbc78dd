import { forwardRef, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

interface ShellProps {
  label: string;
  name: string;
  id?: string;
  error?: string;
  hint?: ReactNode;
}

/** Ids and wiring shared by every labelled control: the hint and the error are linked by aria-describedby. */
function describe({ name, id, error, hint }: ShellProps) {
  const inputId = id ?? `field-${name}`;
  const errorId = `${inputId}-error`;
  const hintId = `${inputId}-hint`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(" ") || undefined;
  return { inputId, errorId, hintId, describedBy };
}

function Shell({ label, error, hint, ids, children }: ShellProps & { ids: ReturnType<typeof describe>; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={ids.inputId} className="font-medium">
        {label}
      </label>
      {hint ? (
        <p id={ids.hintId} className="text-sm text-humus-600">
          {hint}
        </p>
      ) : null}
      {children}
      <p id={ids.errorId} aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {error ?? ""}
      </p>
    </div>
  );
}

/** The look of a text box or a select, for the few placed without a Field around them. */
export const inputClass = "min-h-11 rounded-lg border border-humus-300 bg-white px-3 py-2";

const controlClass = (error: string | undefined, extra: string) => `${inputClass} ${error ? "border-ember-600" : ""} ${extra}`;

interface FieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "name">, ShellProps {}

/** A labelled input whose error is linked by aria-describedby and announced when it appears. */
export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field({ label, name, error, hint, id, className = "", ...props }, ref) {
  const ids = describe({ label, name, error, hint, id });
  return (
    <Shell label={label} name={name} error={error} hint={hint} ids={ids}>
      <input ref={ref} id={ids.inputId} name={name} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} className={controlClass(error, className)} {...props} />
    </Shell>
  );
});

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "name">, ShellProps {}

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField({ label, name, error, hint, id, className = "", children, ...props }, ref) {
  const ids = describe({ label, name, error, hint, id });
  return (
    <Shell label={label} name={name} error={error} hint={hint} ids={ids}>
      <select ref={ref} id={ids.inputId} name={name} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} className={controlClass(error, className)} {...props}>
        {children}
      </select>
    </Shell>
  );
});

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "name">, ShellProps {}

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextAreaFieldProps>(function TextAreaField({ label, name, error, hint, id, className = "", ...props }, ref) {
  const ids = describe({ label, name, error, hint, id });
  return (
    <Shell label={label} name={name} error={error} hint={hint} ids={ids}>
      <textarea ref={ref} id={ids.inputId} name={name} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} className={controlClass(error, className)} {...props} />
    </Shell>
  );
});

/** The error line for a group of radios or checkboxes, announced when it appears. */
export function GroupError({ id, error }: { id: string; error?: string }) {
  return (
    <p id={id} aria-live="polite" className="min-h-5 text-sm text-ember-600">
      {error ?? ""}
    </p>
  );
}
