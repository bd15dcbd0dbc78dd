"use client";
import type { MaterialCode } from "@/lib/calc/facts";
import { type UnitSystem } from "@/lib/calc/units";
import { formatQuantity } from "@/lib/format/quantity";
import { materialNoun } from "@/lib/match/format";
import { MAX_RADIUS_KM } from "@/lib/match/defaults";
import { NO_SUBSTITUTE, SUBSTITUTES } from "@/lib/match/substitutes";
import type { Need } from "@/lib/match/types";
import { Button } from "@/components/ui/button";
import { AskForIt } from "@/components/needs/ask-for-it";

/** The next radius to offer: double, at least 10 km more, never past the limit. */
export const widerRadius = (km: number) => Math.min(MAX_RADIUS_KM, Math.max(km * 2, km + 10));

export function UnmetNeeds({
  unmet,
  radiusKm,
  system,
  onWiden,
  onSubstitute,
  bedId,
}: {
  unmet: Need[];
  radiusKm: number;
  system: UnitSystem;
  /** A saved bed's plan: each unmet material can become an open need. */
  bedId?: string;
  onWiden: (km: number) => void;
  onSubstitute: (need: Need, material: MaterialCode) => void;
}) {
  if (!unmet.length) return null;
  const wider = widerRadius(radiusKm);
  return (
    <section aria-labelledby="unmet-title" className="rounded-lg border-l-4 border-litter-500 bg-litter-100 p-4">
      <h3 id="unmet-title" className="font-semibold">
        Not enough within {formatQuantity(radiusKm, "km", system)}
      </h3>
      <ul className="mt-2 flex flex-col gap-3">
        {unmet.map((n) => (
          <li key={n.material} className="flex flex-col gap-2">
            <p>
              Still missing <strong>{formatQuantity(n.quantity, n.unit, system)}</strong> of {materialNoun(n.material)}.
            </p>
            <div className="flex flex-wrap gap-2">
              {(SUBSTITUTES[n.material] ?? [])
                .filter((s) => s.material !== n.material)
                .map((s) => (
                  <Button key={s.material} variant="secondary" onClick={() => onSubstitute(n, s.material)} title={s.why}>
                    Use {materialNoun(s.material)} instead
                  </Button>
                ))}
            </div>
            {SUBSTITUTES[n.material]?.length ? (
              <p className="text-sm text-humus-700">{SUBSTITUTES[n.material]![0].why}</p>
            ) : NO_SUBSTITUTE[n.material] ? (
              <p className="text-sm text-humus-700">{NO_SUBSTITUTE[n.material]}</p>
            ) : null}
            {bedId ? <AskForIt bedId={bedId} need={n} radiusKm={radiusKm} system={system} /> : null}
          </li>
        ))}
      </ul>
      {radiusKm < MAX_RADIUS_KM ? (
        <Button variant="quiet" className="mt-3" onClick={() => onWiden(wider)}>
          Look further, up to {formatQuantity(wider, "km", system)}
        </Button>
      ) : null}
    </section>
  );
}
