"use client";
import type { UnitSystem } from "@/lib/calc/units";
import { UnitSwitch } from "@/components/ui/unit-switch";
import { EstimateView, type ShownEstimate } from "./estimate-view";

/**
 * A saved bed's estimate. Its advice and timeline are written on the server in the units
 * shown, so the unit switch asks the page again in the others.
 */
export function BedEstimate({ result, system }: { result: ShownEstimate; system: UnitSystem }) {
  return (
    <section aria-labelledby="bed-plan-title" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="bed-plan-title" className="text-xl font-semibold">
          The plan for this bed
        </h2>
        <UnitSwitch />
      </div>
      <EstimateView
        result={result}
        system={system}
        costsHint={result.costs ? undefined : "Give the bed a place on the map (Change the bed) to see what it will cost from the nearest listings."}
      />
    </section>
  );
}
