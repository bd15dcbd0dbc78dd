"use client";
import { useState } from "react";
import { inputUnit, type DisplayUnit, type UnitSystem } from "@/lib/calc/units";
import { Field } from "./field";

/** A figure typed in the reader's unit, shown without false precision (two decimals at most). */
const shown = (x: number) => (Number.isFinite(x) ? String(Number(x.toFixed(2))) : "");

/**
 * A number field that holds an SI value (the form's and the API's) but is read and typed in
 * the viewer's unit: miles for a radius, cubic yards for bulk, pounds for weight. What the
 * person typed stays as typed; only a change from outside (a button, a unit switch) rewrites it.
 */
export function MeasureField({
  label,
  name,
  id,
  unit,
  system,
  value,
  onChange,
  error,
  hint,
  max,
}: {
  label: string;
  name: string;
  id?: string;
  unit: DisplayUnit;
  system: UnitSystem;
  /** The SI value (NaN while the field is empty or not a number). */
  value: number;
  onChange: (si: number) => void;
  error?: string;
  hint?: string;
  /** The largest SI value, shown in the reader's unit. */
  max?: number;
}) {
  const u = inputUnit(unit, system);
  const [text, setText] = useState(() => shown(u.fromSI(value)));
  // The value the text stands for; when the SI value moves away from it, the text follows.
  const [basis, setBasis] = useState({ value, system });
  if (basis.system !== system || (basis.value !== value && !(Number.isNaN(basis.value) && Number.isNaN(value)))) {
    const typed = u.toSI(Number(text));
    if (basis.system !== system || text.trim() === "" || Math.abs(typed - value) > 1e-9 * Math.max(1, Math.abs(value))) setText(shown(u.fromSI(value)));
    setBasis({ value, system });
  }
  return (
    <Field
      label={`${label} (${u.symbol})`}
      name={name}
      id={id}
      type="number"
      step="any"
      inputMode="decimal"
      min={0}
      max={max !== undefined ? Number(u.fromSI(max).toFixed(2)) : undefined}
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        const n = e.target.value.trim() === "" ? NaN : u.toSI(Number(e.target.value));
        setBasis({ value: n, system });
        onChange(n);
      }}
      error={error}
      hint={hint}
    />
  );
}
