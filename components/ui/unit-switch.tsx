"use client";
import { useId } from "react";
import { useUnits } from "./units-context";

const CHOICES = [
  { value: "metric", label: "Metric", units: "m, L, kg" },
  { value: "imperial", label: "Imperial", units: "ft, gal, lb" },
] as const;

/**
 * The one unit switch: metric or imperial for every quantity, distance, price per unit and
 * hint, for visitors too (kept in a cookie). Native radio buttons, so the arrow keys move
 * between them as a radio group should.
 */
export function UnitSwitch({ className = "" }: { className?: string }) {
  const { system, setSystem } = useUnits();
  const name = useId();
  return (
    <fieldset className={`inline-flex items-center gap-1 rounded-lg bg-humus-100 p-1 text-sm ${className}`}>
      <legend className="sr-only">Units</legend>
      {CHOICES.map((c) => (
        <label
          key={c.value}
          title={c.units}
          className={`relative flex min-h-10 cursor-pointer items-center rounded-md px-3 font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-[3px] has-[:focus-visible]:outline-offset-1 has-[:focus-visible]:outline-humus-900 ${
            system === c.value ? "bg-white text-humus-900 shadow-sm ring-1 ring-humus-400" : "text-humus-800"
          }`}
        >
          {/* Laid over its label, invisible: a click or tap lands on the radio itself, and it keeps the arrow keys of a radio group. */}
          <input type="radio" name={name} value={c.value} checked={system === c.value} onChange={() => setSystem(c.value)} className="absolute inset-0 m-0 h-full w-full cursor-pointer opacity-0" />
          {c.label}
        </label>
      ))}
    </fieldset>
  );
}
