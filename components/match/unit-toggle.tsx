"use client";
import type { UnitSystem } from "@/lib/calc/units";

export function UnitToggle({ value, onChange }: { value: UnitSystem; onChange: (v: UnitSystem) => void }) {
  return (
    <fieldset className="flex items-center gap-1 rounded-lg bg-humus-100 p-1 text-sm">
      <legend className="sr-only">Show quantities in</legend>
      {(["metric", "imperial"] as const).map((s) => (
        <label key={s} className={`cursor-pointer rounded-md px-3 py-1.5 font-medium ${value === s ? "bg-white text-humus-900 shadow-sm" : "text-humus-700"}`}>
          <input type="radio" name="unit-system" value={s} checked={value === s} onChange={() => onChange(s)} className="sr-only" />
          {s === "metric" ? "m, kg" : "ft, lb"}
        </label>
      ))}
    </fieldset>
  );
}
