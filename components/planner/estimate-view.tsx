"use client";
import type { EstimateResult } from "@/lib/calc/estimate";
import { MATERIALS, PLANT_INTO_MONTHS, type MaterialCode } from "@/lib/calc/facts";
import type { UnitSystem } from "@/lib/calc/units";
import { formatCount, formatQuantity, formatRange } from "@/lib/format/quantity";
import { formatDay } from "@/lib/listings/format";
import type { BedCosts } from "@/lib/match/costs";
import { Notice } from "@/components/ui/notice";
import { CrossSection } from "./cross-section";
import { CnBand } from "./cn-band";
import { BedCostsView, costOf, materialCostText } from "./bed-costs";

type Need = EstimateResult["needs"][number];
/** An estimate as the route answers it, with costs when it was asked to price the bed. */
export type ShownEstimate = EstimateResult & { costs?: BedCosts };

function countOf(n: Need): string | null {
  if ("sheets" in n) return `${n.sheets} sheets`;
  if ("bags" in n) return `about ${n.bags} leaf bags`;
  if ("bales" in n) return `${n.bales} ${n.bales === 1 ? "bale" : "bales"}`;
  if ("count" in n) return `${formatCount(n.count)} worms`;
  return null;
}

export function EstimateView({ result, system, costsHint }: { result: ShownEstimate; system: UnitSystem; costsHint?: string }) {
  const depth = (m: MaterialCode) => {
    const n = result.needs.find((x) => x.material === m) as { depth_cm?: number } | undefined;
    return n?.depth_cm;
  };
  const water = result.water_range_l;
  return (
    <div className="flex flex-col gap-6" aria-live="polite">
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Stat label="Bed area" value={formatQuantity(result.area_m2, "m2", system)} />
        <Stat
          label="Water for the first soak"
          value={formatRange(water[0], water[1], "l", system)}
          hint={result.water_l > 0 ? `about ${formatQuantity(result.water_l, "l", system)}, a ${system === "metric" ? `${result.water_depth_mm} mm` : formatQuantity(result.water_depth_mm / 10, "cm", system)} soak` : undefined}
        />
        <Stat label="Carbon : nitrogen" value={result.blend.cn_ratio === null ? "—" : `${result.blend.cn_ratio.toFixed(0)} : 1`} />
        <Stat label="Moisture as laid" value={result.blend.moisture_pct === null ? "—" : `${result.blend.moisture_pct.toFixed(0)} %`} />
      </dl>
      {result.water_l > 0 ? (
        <p className="-mt-3 text-sm text-humus-700" data-testid="water-note">
          A range, because leaves, straw and board vary in weight and wetness from load to load; it includes about a quarter more for what drains into the soil below
          (common practice). {result.water.guide}
        </p>
      ) : null}

      <section aria-labelledby="needs-title">
        <h3 id="needs-title" className="mb-2 text-lg font-semibold">
          What the bed takes
        </h3>
        <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-humus-200">
          <table className="w-full text-left text-sm">
            <thead className="bg-humus-100">
              <tr>
                <th scope="col" className="p-3">Layer</th>
                <th scope="col" className="p-3">Amount</th>
                <th scope="col" className="p-3">In units</th>
                <th scope="col" className="p-3">Weight</th>
                {result.costs ? <th scope="col" className="p-3">Cost nearby</th> : null}
              </tr>
            </thead>
            <tbody>
              {result.needs.map((n) => (
                <tr key={n.material} className="border-t border-humus-100" data-material={n.material}>
                  <th scope="row" className="p-3 font-medium">{MATERIALS[n.material as MaterialCode]?.name ?? n.material}</th>
                  <td className="p-3">{formatQuantity(n.quantity, n.unit as "m2" | "m3" | "kg", system)}</td>
                  <td className="p-3">{countOf(n) ?? "—"}</td>
                  <td className="p-3">{"mass_kg" in n && n.mass_kg !== undefined ? formatQuantity(n.mass_kg, "kg", system) : n.unit === "kg" ? formatQuantity(n.quantity, "kg", system) : "—"}</td>
                  {result.costs ? <td className="p-3" data-cost-of={n.material}>{materialCostText(costOf(result.costs, n.material)) ?? "not found nearby"}</td> : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {result.needs.some((n) => n.material === "worms") ? (
          <p className="mt-2 text-sm text-humus-600">
            There is no published stocking rate for worms in an outdoor bed; the worm amount is our own starting figure. Fewer worms multiply to fill the bed, just more slowly.
          </p>
        ) : null}
      </section>

      {result.costs ? <BedCostsView costs={result.costs} system={system} /> : costsHint ? <p className="text-sm text-humus-700">{costsHint}</p> : null}

      <div className="grid gap-4 md:grid-cols-2">
        <section aria-labelledby="layers-title">
          <h3 id="layers-title" className="mb-2 text-lg font-semibold">
            The layers
          </h3>
          <CrossSection
            depths={{ cardboard: result.needs.some((n) => n.material === "cardboard"), leaves: depth("leaves"), straw: depth("straw"), wood_chips: depth("wood_chips") }}
            settling={result.settling}
            system={system}
          />
        </section>
        <section aria-labelledby="mix-title">
          <h3 id="mix-title" className="mb-2 text-lg font-semibold">
            How the mix will break down
          </h3>
          <CnBand value={result.blend.cn_ratio} />
          {result.blend.advice ? (
            <p className="mt-2 text-sm text-humus-800" data-testid="blend-advice">
              {result.blend.advice}
            </p>
          ) : (
            <p className="mt-2 text-sm text-humus-700">This mix sits in the composting range.</p>
          )}
        </section>
      </div>

      <section aria-labelledby="planting-title" className="rounded-lg bg-moss-50 p-4 ring-1 ring-moss-200" data-testid="planting">
        <h3 id="planting-title" className="font-semibold">
          When to plant
        </h3>
        <p className="text-sm text-humus-800">
          You can plant into it from <strong>{formatDay(result.planting.plant_into_from)}</strong>: about {PLANT_INTO_MONTHS.from}–{PLANT_INTO_MONTHS.until} months after building is{" "}
          {PLANT_INTO_MONTHS.source}. Most of the material will have turned to soil by <strong>{formatDay(result.planting.soil_by)}</strong>, about a year on.
        </p>
      </section>

      <section aria-labelledby="timeline-title">
        <h3 id="timeline-title" className="mb-2 text-lg font-semibold">
          The year ahead
        </h3>
        <ol className="relative flex flex-col gap-3 border-l-2 border-moss-200 pl-5">
          {result.timeline.map((t, i) => (
            <li key={`${t.key}-${t.date}-${i}`} className="relative" data-step={t.key}>
              <span className="absolute -left-[27px] top-1 h-3 w-3 rounded-full bg-moss-500" aria-hidden="true" />
              <p className="text-sm font-mono text-humus-600">
                <time dateTime={t.date}>{t.date}</time>
              </p>
              <p className="font-semibold">{t.title}</p>
              {t.detail ? <p className="text-sm text-humus-700">{t.detail}</p> : null}
            </li>
          ))}
        </ol>
      </section>

      <section aria-labelledby="care-title">
        <h3 id="care-title" className="mb-2 text-lg font-semibold">
          Take care
        </h3>
        <Notice tone="caution">
          <ul className="list-disc space-y-1 pl-5">
            {result.cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </Notice>
      </section>
    </div>
  );
}

function Stat({ label, value, hint }: { label: string; value: string; hint?: string }) {
  return (
    <div className="rounded-lg bg-white p-4 ring-1 ring-humus-200">
      <dt className="text-sm text-humus-600">{label}</dt>
      <dd className="text-xl font-bold">{value}</dd>
      {hint ? <dd className="text-sm text-humus-600">{hint}</dd> : null}
    </div>
  );
}
