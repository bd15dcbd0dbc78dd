"use client";
import type { FormHTMLAttributes } from "react";
import { useHydrated } from "./use-hydrated";

// Every form here is handled by React in the browser. Until the page has hydrated its
// fields are disabled: anything typed earlier would be lost or half-kept when React takes
// over, and a submit would go out as a plain GET with the fields in the address.
export function Form({ children, ...props }: FormHTMLAttributes<HTMLFormElement> & { ref?: React.Ref<HTMLFormElement> }) {
  const hydrated = useHydrated();
  return (
    <form {...props}>
      <fieldset disabled={!hydrated} className="contents">
        {children}
      </fieldset>
    </form>
  );
}
