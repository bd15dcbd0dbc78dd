"use client";
import { usePathname, useRouter } from "next/navigation";
import type { UnitSystem } from "@/lib/calc/units";
import { EstimateView, type ShownEstimate } from "./estimate-view";
import { UnitToggle } from "./unit-toggle";

/**
 * A saved bed's estimate. Its advice and timeline are written on the server in the units
 * shown, so switching units asks the page again in the others.
 */
export function BedEstimate({ result, system }: { result: ShownEstimate; system: UnitSystem }) {
  const router = useRouter();
  const pathname = usePathname();
  return (
    <div className="flex flex-col gap-4">
      <UnitToggle value={system} onChange={(u) => router.replace(`${pathname}?units=${u}`, { scroll: false })} />
      <EstimateView
        result={result}
        system={system}
        costsHint={result.costs ? undefined : "Give the bed a place on the map (Change the bed) to see what it will cost from the nearest listings."}
      />
    </div>
  );
}
