"use client";
import { useState } from "react";
import type { EstimateResult } from "@/lib/calc/estimate";
import type { UnitSystem } from "@/lib/calc/units";
import { EstimateView } from "./estimate-view";
import { UnitToggle } from "./unit-toggle";

export function BedEstimate({ result, system: initial }: { result: EstimateResult; system: UnitSystem }) {
  const [system, setSystem] = useState(initial);
  return (
    <div className="flex flex-col gap-4">
      <UnitToggle value={system} onChange={setSystem} />
      <EstimateView result={result} system={system} />
    </div>
  );
}
