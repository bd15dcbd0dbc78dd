"use client";
import type { UnitSystem } from "@/lib/calc/units";

export function UnitToggle({ value, onChange }: { value: UnitSystem; onChange: (u: UnitSystem) => void }) {
  return (
    <div role="radiogroup" aria-label="Units" className="inline-flex rounded-lg bg-humus-100 p-1">
      {(["metric", "imperial"] as const).map((u) => (
        <button
          key={u}
          type="button"
          role="radio"
          aria-checked={value === u}
          onClick={() => onChange(u)}
          className={`min-h-10 rounded-md px-3 text-sm font-semibold ${value === u ? "bg-white text-humus-900 shadow-sm" : "text-humus-700"}`}
        >
          {u === "metric" ? "Metric (m, L, kg)" : "Imperial (ft, gal, lb)"}
        </button>
      ))}
    </div>
  );
}
