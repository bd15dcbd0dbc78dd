import { forwardRef, type InputHTMLAttributes, type ReactNode } from "react";

// A checkbox or radio with its words. The box itself is drawn in globals.css in the palette;
// here it gets a target of at least 44 px and a label that wraps beside it.
interface ChoiceProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "type"> {
  label: ReactNode;
  hint?: ReactNode;
}

function choice(type: "checkbox" | "radio") {
  return forwardRef<HTMLInputElement, ChoiceProps>(function Choice({ label, hint, className = "", ...props }, ref) {
    return (
      <label className={`flex min-h-11 items-start gap-3 py-2 ${className}`.trim()}>
        <input ref={ref} type={type} className="mt-0.5" {...props} />
        <span className="flex flex-col">
          <span>{label}</span>
          {hint ? <span className="text-sm text-humus-600">{hint}</span> : null}
        </span>
      </label>
    );
  });
}

export const Checkbox = choice("checkbox");
export const Radio = choice("radio");
