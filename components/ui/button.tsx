import type { ButtonHTMLAttributes } from "react";
import { buttonClass, type ButtonVariant } from "./button-class";

export type { ButtonVariant };

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  return <button type="button" className={buttonClass(variant, className)} {...props} />;
}
