"use client";
import type { ButtonHTMLAttributes } from "react";
import { buttonClass, type ButtonVariant } from "./button-class";
import { useHydrated } from "./use-hydrated";

export type { ButtonVariant };

// Every form here is handled in the browser. A submit pressed before the page has
// hydrated would send a plain GET with the fields (a password too) in the address, so
// submit buttons wait for React.
export function Button({ variant = "primary", className = "", type = "button", disabled, ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  const hydrated = useHydrated();
  return <button type={type} disabled={disabled || (type === "submit" && !hydrated)} className={buttonClass(variant, className)} {...props} />;
}
